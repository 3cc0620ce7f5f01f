// Re-hash every issued revision against its manifest: missing, altered and extra files, broken
// manifests, gaps in the numbering and a manifest chain that does not link up are all findings.
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { parseManifest, REVISION_FILES, type Manifest } from './manifest.js';
import { revisionDirName, revisionNumbers } from './revisions.js';
import { sha256 } from './hash.js';
import { isWorkingName } from './files.js';

export interface Finding {
  /** relative to the archive folder, e.g. "harbour-lane/rev-2/pack.pdf" */
  path: string;
  problem: string;
}

export interface IssuedRevision {
  number: number;
  dir: string;
  manifest: Manifest;
  manifestSha: string;
}

export interface JobArchive {
  job: string;
  dir: string;
  /** the revisions whose manifest could be read, ascending */
  revisions: IssuedRevision[];
  findings: Finding[];
}

function inspectRevision(jobOut: string, job: string, n: number, findings: Finding[]): IssuedRevision | null {
  const name = revisionDirName(n);
  const dir = join(jobOut, name);
  const at = (f: string) => `${job}/${name}/${f}`;
  if (!statSync(dir).isDirectory()) {
    findings.push({ path: `${job}/${name}`, problem: 'not a folder; a revision is a folder' });
    return null;
  }
  const manifestPath = join(dir, 'manifest.json');
  if (!existsSync(manifestPath)) {
    findings.push({ path: at('manifest.json'), problem: 'missing: the revision cannot be checked without its manifest' });
    return null;
  }
  const text = readFileSync(manifestPath);
  const parsed = parseManifest(text.toString('utf8'));
  if (!parsed.ok) {
    findings.push({ path: at('manifest.json'), problem: `unreadable: ${parsed.why}` });
    return null;
  }
  const m = parsed.manifest;
  if (m.job !== job || m.revision.number !== n) {
    findings.push({ path: at('manifest.json'), problem: `describes ${m.job} revision ${m.revision.number}, but stands in ${job}/${name}` });
  }
  for (const f of REVISION_FILES) {
    if (!(f in m.outputs)) findings.push({ path: at(f), problem: 'not listed in the manifest; every revision lists its pack.html, pack.pdf and data.json' });
  }
  for (const [f, want] of Object.entries(m.outputs)) {
    const path = join(dir, f);
    if (!existsSync(path)) {
      findings.push({ path: at(f), problem: 'missing' });
      continue;
    }
    const got = sha256(readFileSync(path));
    if (got !== want) findings.push({ path: at(f), problem: `altered: SHA-256 is ${got}, the manifest says ${want}` });
  }
  for (const f of readdirSync(dir).sort()) {
    if (f !== 'manifest.json' && !(f in m.outputs)) findings.push({ path: at(f), problem: 'extra: not listed in the manifest' });
  }
  return { number: n, dir, manifest: m, manifestSha: sha256(text) };
}

/** One job's revisions in the archive folder `out`. */
export function inspectJob(out: string, job: string): JobArchive {
  const dir = join(out, job);
  const findings: Finding[] = [];
  const revisions: IssuedRevision[] = [];
  const numbers = revisionNumbers(dir);
  numbers.forEach((n, i) => {
    const expected = i === 0 ? 1 : numbers[i - 1]! + 1;
    for (let gap = expected; gap < n; gap++) findings.push({ path: `${job}/${revisionDirName(gap)}`, problem: 'missing: later revisions exist' });
    const r = inspectRevision(dir, job, n, findings);
    if (r) revisions.push(r);
  });
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
  return { job, dir, revisions, findings };
}

/** The job folders of an archive: its visible sub-folders, by name. */
export function archiveJobs(out: string): string[] {
  if (!existsSync(out)) return [];
  return readdirSync(out, { withFileTypes: true })
    .filter((e) => e.isDirectory() && !e.name.startsWith('.') && !isWorkingName(e.name))
    .map((e) => e.name)
    .sort();
}

export function verifyArchive(out: string): { jobs: JobArchive[]; findings: Finding[] } {
  const jobs = archiveJobs(out).map((j) => inspectJob(out, j)).filter((j) => j.revisions.length > 0 || j.findings.length > 0);
  return { jobs, findings: jobs.flatMap((j) => j.findings) };
}
