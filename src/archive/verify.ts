// Re-hash every issued revision against its manifest: missing, altered and extra files, broken
// manifests, gaps in the numbering, a manifest chain that does not link up, anything hidden from
// the walk (dot-names, symbolic links, other kinds of file) and, given the firm's public key, a
// signature that is missing, made with another key or does not match are all findings.
import { existsSync, lstatSync, readdirSync, readFileSync, type Stats } from 'node:fs';
import { join } from 'node:path';
import type { KeyObject } from 'node:crypto';
import { parseManifest, REVISION_FILES, type Manifest } from './manifest.js';
import { revisionDirName } from './revisions.js';
import { sha256 } from './hash.js';
import { isWorkingName } from './files.js';
import { checkSignature, SIGNATURE_FILE, type SignatureCheck } from './sign.js';
import type { KnownHashes } from './known.js';

export interface Finding {
  /** relative to the archive folder, e.g. "harbour-lane/rev-2/pack.pdf" (or to the job folders' folder for revisions.yaml) */
  path: string;
  problem: string;
}

export interface IssuedRevision {
  number: number;
  dir: string;
  manifest: Manifest;
  manifestSha: string;
  /** null: unsigned */
  signature: SignatureCheck | null;
}

export interface JobArchive {
  job: string;
  dir: string;
  /** the revisions whose manifest could be read, ascending */
  revisions: IssuedRevision[];
  findings: Finding[];
  /** working folders of interrupted issues (hidden names packsmith gives them) */
  leftovers: string[];
}

export interface InspectOptions {
  /** the firm's public key: the latest revision must carry a signature it checks (which covers the earlier ones through the chain), and every signature must check; null: signatures are read, not checked */
  publicKey?: KeyObject | null;
  /** the build's memory of files' hashes by size and time (verify leaves it out and re-hashes every file) */
  known?: KnownHashes | null;
}

const REV_DIR = /^rev-([1-9]\d*)$/;

function lstat(path: string): Stats | null {
  try {
    return lstatSync(path);
  } catch {
    return null;
  }
}

/** What is not a plain file or folder: a symbolic link or a device hides what the walk would see. */
function oddKind(st: Stats): string | null {
  if (st.isSymbolicLink()) return 'a symbolic link; an archive holds only real files and folders';
  if (!st.isFile() && !st.isDirectory()) return 'not a file or a folder';
  return null;
}

function inspectRevision(jobOut: string, job: string, n: number, findings: Finding[], opts: InspectOptions): IssuedRevision | null {
  const name = revisionDirName(n);
  const dir = join(jobOut, name);
  const at = (f: string) => `${job}/${name}/${f}`;
  const st = lstat(dir)!;
  if (!st.isDirectory() || st.isSymbolicLink()) {
    findings.push({ path: `${job}/${name}`, problem: st.isSymbolicLink() ? 'a symbolic link; a revision is a real folder' : 'not a folder; a revision is a folder' });
    return null;
  }
  const entries = readdirSync(dir).sort();
  const kinds = new Map(entries.map((f) => [f, lstat(join(dir, f))]));
  for (const [f, s] of kinds) {
    const odd = s && oddKind(s);
    if (odd || s?.isDirectory()) findings.push({ path: at(f), problem: odd ?? 'a folder; a revision holds files only' });
  }
  const plain = (f: string) => kinds.get(f)?.isFile() === true;
  if (!plain('manifest.json')) {
    if (!kinds.has('manifest.json')) findings.push({ path: at('manifest.json'), problem: 'missing: the revision cannot be checked without its manifest' });
    return null;
  }
  const text = readFileSync(join(dir, 'manifest.json'));
  const parsed = parseManifest(text.toString('utf8'));
  if (!parsed.ok) {
    findings.push({ path: at('manifest.json'), problem: `unreadable: ${parsed.why}` });
    return null;
  }
  const m = parsed.manifest;
  const manifestSha = sha256(text);
  if (m.job !== job || m.revision.number !== n) {
    findings.push({ path: at('manifest.json'), problem: `describes ${m.job} revision ${m.revision.number}, but stands in ${job}/${name}` });
  }
  for (const f of REVISION_FILES) {
    if (!(f in m.outputs)) findings.push({ path: at(f), problem: 'not listed in the manifest; every revision lists its pack.html, pack.pdf and data.json' });
  }
  for (const [f, want] of Object.entries(m.outputs)) {
    if (!kinds.has(f)) {
      findings.push({ path: at(f), problem: 'missing' });
      continue;
    }
    if (!plain(f)) continue; // already a finding
    const compute = () => sha256(readFileSync(join(dir, f)));
    const got = opts.known ? opts.known.hash(dir, manifestSha, f, kinds.get(f)!, compute) : compute();
    if (got !== want) findings.push({ path: at(f), problem: `altered: SHA-256 is ${got}, the manifest says ${want}` });
  }
  for (const f of entries) {
    if (f !== 'manifest.json' && f !== SIGNATURE_FILE && !(f in m.outputs)) findings.push({ path: at(f), problem: 'extra: not listed in the manifest' });
  }
  let signature: SignatureCheck | null = null;
  if (plain(SIGNATURE_FILE)) {
    signature = checkSignature(text, readFileSync(join(dir, SIGNATURE_FILE), 'utf8'), opts.publicKey ?? null);
    if (signature.status === 'invalid') findings.push({ path: at(SIGNATURE_FILE), problem: signature.why });
    if (signature.status === 'other-key') findings.push({ path: at(SIGNATURE_FILE), problem: `signed with the key ${signature.key}, not the firm's key` });
  }
  return { number: n, dir, manifest: m, manifestSha, signature };
}

/** One job's revisions in the archive folder `archive`. */
export function inspectJob(archive: string, job: string, opts: InspectOptions = {}): JobArchive {
  const dir = join(archive, job);
  const findings: Finding[] = [];
  const revisions: IssuedRevision[] = [];
  const leftovers: string[] = [];
  const numbers: number[] = [];
  const st = lstat(dir);
  if (st?.isSymbolicLink()) findings.push({ path: job, problem: 'a symbolic link; a job\'s archive is a real folder' });
  else if (st?.isDirectory()) {
    for (const name of readdirSync(dir).sort()) {
      const m = REV_DIR.exec(name);
      if (m) numbers.push(Number(m[1]));
      else if (isWorkingName(name)) leftovers.push(name);
      else findings.push({ path: `${job}/${name}`, problem: `extra: ${name.startsWith('.') ? 'a hidden name; ' : ''}a job's archive holds only its rev-N folders` });
    }
  }
  numbers.sort((a, b) => a - b);
  numbers.forEach((n, i) => {
    const expected = i === 0 ? 1 : numbers[i - 1]! + 1;
    for (let gap = expected; gap < n; gap++) findings.push({ path: `${job}/${revisionDirName(gap)}`, problem: 'missing: later revisions exist' });
    const r = inspectRevision(dir, job, n, findings, opts);
    if (r) revisions.push(r);
  });
  // The latest revision's signature covers the revisions before it through the chain of manifest hashes.
  const latest = revisions.at(-1);
  if (opts.publicKey && latest && latest.signature === null) {
    findings.push({ path: `${job}/${revisionDirName(latest.number)}/${SIGNATURE_FILE}`, problem: 'missing: the latest revision is unsigned, and the firm signs its revisions' });
  }
  for (const r of revisions) {
    const before = revisions.find((p) => p.number === r.number - 1);
    const link = r.manifest.previous;
    const path = `${job}/${revisionDirName(r.number)}/manifest.json`;
    if (r.number === 1 && link !== null) findings.push({ path, problem: 'names a previous revision, but this is revision 1' });
    if (r.number > 1 && (link === null || link.revision !== r.number - 1)) {
      findings.push({ path, problem: `does not name revision ${r.number - 1} as its previous one` });
    } else if (before && link && link.manifest_sha256 !== before.manifestSha) {
      findings.push({ path: `${job}/${revisionDirName(before.number)}/manifest.json`, problem: `altered: revision ${r.number} recorded its SHA-256 as ${link.manifest_sha256}, it is now ${before.manifestSha}` });
    }
  }
  return { job, dir, revisions, findings, leftovers };
}

/** The job folders of an archive (its sub-folders, by name), and findings for anything else in it: hidden names, links, files. */
export function walkArchive(archive: string): { jobs: string[]; findings: Finding[] } {
  if (!existsSync(archive)) return { jobs: [], findings: [] };
  const jobs: string[] = [];
  const findings: Finding[] = [];
  for (const name of readdirSync(archive).sort()) {
    const st = lstat(join(archive, name));
    if (!st) continue;
    const odd = oddKind(st);
    if (odd) findings.push({ path: name, problem: odd });
    else if (!st.isDirectory()) findings.push({ path: name, problem: 'extra: a file; the archive holds one folder per job' });
    else if (name.startsWith('.')) findings.push({ path: name, problem: `hidden: a job's archive under a dot-name; the archive holds one visibly named folder per job` });
    else jobs.push(name);
  }
  return { jobs, findings };
}

/** The job folders of an archive: its visible sub-folders, by name. */
export const archiveJobs = (archive: string): string[] => walkArchive(archive).jobs;

/** Every job in the archive folder, with what the walk itself found. */
export function verifyArchive(archive: string, opts: InspectOptions = {}): { jobs: JobArchive[]; findings: Finding[] } {
  const walk = walkArchive(archive);
  const jobs = walk.jobs.map((j) => inspectJob(archive, j, opts));
  return { jobs, findings: [...walk.findings, ...jobs.flatMap((j) => j.findings)] };
}
