// `issue`: freeze the next revision of a job into <archive>/<job>/rev-N/ (pack.html, pack.pdf,
// data.json, manifest.json, and manifest.sig when signed) and record it in the job's
// revisions.yaml with its manifest's SHA-256. The archive is the job's own (location.ts), never
// the drafts' out/, which only gets the site rewritten. Refused, with the reason, when the job has
// errors, when nothing changed since the last revision, when the archive or the record does not
// check out, or when checks fail or are not verified (unless open items are accepted).
import { join } from 'node:path';
import { loadJob } from './job.js';
import { formatError } from './load/raw.js';
import type { Project } from './model/validate.js';
import type { Assessment } from './calc/types.js';
import { engineCache } from './render/engine.js';
import { findChromium, NO_CHROMIUM_HELP } from './print/browser.js';
import { isIsoDay } from './model/dates.js';
import { packData, dataBytes, type RevisionInfo } from './archive/data.js';
import { combinedHash, fileHashes, sha256 } from './archive/hash.js';
import { inspectJob, type JobArchive } from './archive/verify.js';
import { changesSince } from './archive/previous.js';
import { manifestBytes, type Manifest } from './archive/manifest.js';
import { recordEntry, writeRecord, revisionDirName, type RecordEntry } from './archive/revisions.js';
import { checkRecord } from './archive/record.js';
import { jobArchiveSettings } from './archive/location.js';
import { fingerprint, loadPrivateKey, loadPublicKey, signatureBytes, SIGNATURE_FILE } from './archive/sign.js';
import { createHash, type KeyObject } from 'node:crypto';
import { openStaging } from './archive/freeze.js';
import { clearStale } from './archive/files.js';
import { step } from './archive/steps.js';
import { writeSite } from './archive/site.js';
import { claimOut, OutputFolderError } from './archive/out.js';
import { lazyPrinter, packFiles, packPdf, styleOf } from './produce.js';
import { VERSION } from './version.js';

export interface IssueOptions {
  /** the job folder */
  job: string;
  /** the drafts' folder (out/), whose site is rewritten */
  out: string;
  /** `--archive DIR`, else the firm file's `archive`, else archive/ beside the job folders' folder */
  archive?: string | null;
  /** the firm's private key file (--key or PACKSMITH_KEY): the manifest is signed with it */
  key?: string | null;
  by: string;
  /** YYYY-MM-DD */
  date: string;
  reason: string | null;
  acceptOpenItems: boolean;
  /** today's date, read by the caller: a test session dated later is an input error */
  today?: string;
}

export type IssueResult =
  | { ok: true; revision: number; dir: string; files: string[]; openItems: number; notes: string[]; signedWith: string | null }
  | { ok: false; code: 1 | 2; reasons: string[] };

const refuse = (code: 1 | 2, ...reasons: string[]): IssueResult => ({ ok: false, code, reasons });

const MAX_LISTED = 12;

function openItemsText(assessment: Assessment): string[] {
  const open = (status: 'fail' | 'not-verified') => assessment.circuits.flatMap((c) => c.checks.filter((k) => k.status === status).map((k) => `  ${c.board} circuit ${c.ref} ${k.id}: ${status} (${k.basis})`));
  const items = [...open('fail'), ...open('not-verified')];
  return items.length > MAX_LISTED ? [...items.slice(0, MAX_LISTED), `  ... and ${items.length - MAX_LISTED} more (packsmith check lists them all)`] : items;
}

/**
 * The archive and revisions.yaml must agree before anything is added to them; only revisions an
 * interrupted issue committed but did not record may be missing from the record (they are recorded now).
 */
function consistency(jobDir: string, project: Project, archive: JobArchive): { refused: IssueResult } | { refused: null; entries: RecordEntry[]; unrecorded: number[] } {
  const rec = checkRecord(jobDir, project.name, archive, archive.dir);
  const unrecorded = new Set(rec.unrecorded.map((n) => join(archive.dir, revisionDirName(n))));
  const findings = [...archive.findings, ...rec.findings.filter((f) => !unrecorded.has(f.path))];
  if (findings.length > 0) {
    return { refused: refuse(1, `the archive of ${project.name} (${archive.dir}) and its revisions.yaml do not check out, so no revision is added:`, ...findings.map((f) => `  ${f.path}: ${f.problem}`), 'run packsmith verify and restore the revision or the record from a copy') };
  }
  return { refused: null, entries: rec.entries, unrecorded: rec.unrecorded };
}

/** The signing key, checked against the firm's public key; null when the firm does not sign. */
function signingKey(keyFile: string | null, publicKeyFile: string | null): { ok: true; key: KeyObject | null } | { ok: false; result: IssueResult } {
  if (!keyFile) {
    if (publicKeyFile) return { ok: false, result: refuse(1, `the firm signs its revisions (public_key: ${publicKeyFile} in packsmith.yaml): give its private key with --key FILE or PACKSMITH_KEY`) };
    return { ok: true, key: null };
  }
  const k = loadPrivateKey(keyFile);
  if (!k.ok) return { ok: false, result: refuse(2, k.why) };
  if (publicKeyFile) {
    const pub = loadPublicKey(publicKeyFile);
    if (!pub.ok) return { ok: false, result: refuse(2, pub.why) };
    if (fingerprint(pub.key) !== fingerprint(k.key)) return { ok: false, result: refuse(2, `${keyFile} is not the firm's key: its public key is ${fingerprint(k.key)}, packsmith.yaml's public_key is ${fingerprint(pub.key)}`) };
  }
  return { ok: true, key: k.key };
}

/** The reasons not to issue now, or none. */
function readiness(opts: IssueOptions, project: Project, assessment: Assessment, inputHash: string, archive: JobArchive): IssueResult | null {
  const latest = archive.revisions.at(-1);
  if (latest && latest.manifest.input_hash === inputHash) {
    return refuse(1, `nothing changed since Revision ${latest.number} (issued ${latest.manifest.revision.date}): the job's files are the same (input hash ${inputHash}), so no new revision was issued`);
  }
  if (latest && opts.date < latest.manifest.revision.date) {
    return refuse(1, `issue date ${opts.date} is before Revision ${latest.number}'s (${latest.manifest.revision.date}); a revision is never dated before the one it follows`);
  }
  const lastTest = project.sessions.at(-1)?.date;
  if (lastTest && opts.date < lastTest) return refuse(1, `issue date ${opts.date} is before the last test session (${lastTest}); a pack is issued after its tests`);
  const s = assessment.summary;
  if (!opts.acceptOpenItems && (s.fail > 0 || s['not-verified'] > 0)) {
    return refuse(
      1,
      `${project.name} has ${[s.fail && `${s.fail} failed`, s['not-verified'] && `${s['not-verified']} not verified`].filter(Boolean).join(' and ')} check${s.fail + s['not-verified'] === 1 ? '' : 's'}, so no revision was issued:`,
      ...openItemsText(assessment),
      'put them right and re-test, or issue with --accept-open-items to hand over a pack that lists them first',
    );
  }
  return null;
}

/**
 * Bring revisions.yaml in line with the archive: every revision it holds, from its manifest.
 * Returns the revisions it had to add, other than `issued` (left out by an interrupted run).
 */
function record(jobDir: string, archive: string, job: string, before: RecordEntry[], issued: number | null): number[] {
  let held = inspectJob(archive, job).revisions;
  for (let round = 0; round < 3; round++) {
    const entries = new Map(before.map((e) => [e.revision, e]));
    for (const r of held) entries.set(r.number, recordEntry(r.manifest, r.manifestSha));
    writeRecord(jobDir, [...entries.values()], () => step('recording'));
    step('recorded');
    const now = inspectJob(archive, job).revisions;
    if (now.length === held.length) break;
    held = now; // another run committed a revision meanwhile: write again with it
  }
  const known = new Set(before.map((e) => e.revision));
  return held.map((r) => r.number).filter((n) => n !== issued && !known.has(n));
}

const restored = (numbers: number[]): string[] =>
  numbers.map((n) => `revisions.yaml: revision ${n} restored from its manifest (an earlier issue was interrupted before recording it)`);

export async function issueRevision(opts: IssueOptions): Promise<IssueResult> {
  if (!opts.by.trim()) return refuse(2, '--by needs the name of the person issuing the pack');
  if (!isIsoDay(opts.date)) return refuse(2, `found issue date "${opts.date}"; expected a date as YYYY-MM-DD`);
  const job = loadJob(opts.job, opts.today ? { today: opts.today } : {});
  if (!job.ok) return refuse(2, ...job.errors.map((e) => `${job.raw.name}/${formatError(e)}`), `${job.errors.length} problem(s) in ${job.raw.name}: nothing was issued`);
  let out: string;
  try {
    out = claimOut(opts.out); // the drafts' folder, whose site is rewritten: checked before anything is written
  } catch (e) {
    if (e instanceof OutputFolderError) return refuse(2, e.message);
    throw e;
  }
  const chromium = findChromium();
  if (!chromium) return refuse(2, `${NO_CHROMIUM_HELP} A revision needs its PDF, so nothing was issued.`);
  const { project, assessment } = job;
  const where = jobArchiveSettings(opts.job, opts.archive ?? null);
  if (where.errors.length > 0) return refuse(2, ...where.errors.map(formatError), 'the firm file has errors: nothing was issued');
  const signing = signingKey(opts.key ?? null, where.publicKey);
  if (!signing.ok) return signing.result;
  const archiveDir = where.archive;
  if (archiveDir === out || archiveDir.startsWith(`${out}/`)) return refuse(2, `the archive (${archiveDir}) is inside the drafts' folder ${out}, which may be deleted and rebuilt at any time: keep issued revisions with the jobs (archive: in packsmith.yaml, or --archive)`);
  const jobDir = job.raw.dir;
  const jobOut = join(archiveDir, project.name);
  const inputs = fileHashes(job.raw.files);
  const inputHash = combinedHash(inputs);
  const style = styleOf(project, job.raw.dir, {}, engineCache());
  const templatesHash = style.templatesHash;
  const printer = lazyPrinter(chromium, 1);
  // what interrupted runs left: working folders beside the revisions, a revisions.yaml replacement
  clearStale(jobOut);
  clearStale(jobDir);
  const notes: string[] = [];
  try {
    for (let attempt = 0; attempt < 5; attempt++) {
      const archive = inspectJob(archiveDir, project.name, { publicKey: signing.key });
      const agreed = consistency(jobDir, project, archive);
      if (agreed.refused) return agreed.refused;
      let entries = agreed.entries;
      if (agreed.unrecorded.length > 0) {
        notes.push(...restored(record(jobDir, archiveDir, project.name, entries, null)));
        entries = archive.revisions.map((r) => recordEntry(r.manifest, r.manifestSha));
      }
      const notReady = readiness(opts, project, assessment, inputHash, archive);
      if (notReady && !notReady.ok) return { ...notReady, reasons: [...notes, ...notReady.reasons] };
      step('loaded');

      const latest = archive.revisions.at(-1) ?? null;
      const n = (latest?.number ?? 0) + 1;
      const info: RevisionInfo = { number: n, date: opts.date, by: opts.by.trim(), reason: opts.reason?.trim() || null };
      const accepted = opts.acceptOpenItems && assessment.summary.fail + assessment.summary['not-verified'] > 0;
      const signedWith = signing.key ? fingerprint(signing.key) : null;
      const label = { label: `Revision ${n}`, draft: false, date: opts.date, acceptedOpenItems: accepted, keyFingerprint: signedWith };
      const data = dataBytes(packData(project, assessment, VERSION, info));
      const since = changesSince(latest, data, { by: info.by, date: info.date, reason: info.reason });
      if (!since.ok) return refuse(1, `cannot compare with Revision ${latest?.number}: ${since.why}; run packsmith verify`);
      const pack = packFiles(project, assessment, label, since.changes, style);
      step('rendered');

      const staging = openStaging(jobOut);
      let committed = false;
      try {
        step('staging');
        const htmlHash = createHash('sha256');
        const htmlPath = staging.add('pack.html', pack.html, (bytes) => htmlHash.update(bytes));
        const htmlSha = htmlHash.digest('hex');
        step('wrote-html');
        const pdf = await packPdf(printer, htmlPath, project, label, pack, style.paper, data);
        step('printed');
        staging.add('pack.pdf', pdf);
        step('wrote-pdf');
        staging.add('data.json', data);
        step('wrote-data');
        const manifest: Manifest = {
          format: 'packsmith-manifest/1',
          packsmith: VERSION,
          job: project.name,
          title: project.file.title,
          firm: project.file.installer.firm,
          revision: { ...info, accepted_open_items: accepted },
          rules: { ...assessment.rules },
          summary: assessment.summary,
          previous: latest ? { revision: latest.number, manifest_sha256: latest.manifestSha } : null,
          input_hash: inputHash,
          inputs,
          templates_hash: templatesHash,
          outputs: { 'pack.html': htmlSha, 'pack.pdf': sha256(pdf), 'data.json': sha256(data) },
        };
        const manifestText = manifestBytes(manifest);
        staging.add('manifest.json', manifestText);
        if (signing.key) staging.add(SIGNATURE_FILE, signatureBytes(manifestText, signing.key));
        step('wrote-manifest');
        staging.seal();
        step('sealed');
        step('committing');
        if (staging.commit(n) === 'taken') continue; // another run issued revision n meanwhile: look again
        committed = true;
      } finally {
        if (!committed) staging.discard();
      }
      step('committed');
      notes.push(...restored(record(jobDir, archiveDir, project.name, entries, n)));
      writeSite(out, [{ job: project.name, archive: archiveDir }]);
      step('done');
      const s = assessment.summary;
      return {
        ok: true,
        revision: n,
        dir: join(jobOut, revisionDirName(n)),
        files: ['pack.html', 'pack.pdf', 'data.json', 'manifest.json', ...(signedWith ? [SIGNATURE_FILE] : [])],
        openItems: s.fail + s['not-verified'],
        notes,
        signedWith,
      };
    }
    return refuse(1, 'other runs kept taking the next revision number; try again');
  } finally {
    await printer.close();
  }
}
