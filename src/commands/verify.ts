// `packsmith verify [DIR] [--key FILE.pub] [--archive DIR]`: the whole record checked both ways —
// every revision each job's revisions.yaml records stands in the archive with the same manifest,
// every revision in the archive is recorded, every file matches its manifest, nothing is hidden —
// and every signature checked against the firm's public key (--key, else packsmith.yaml's
// public_key). DIR is a folder of job folders (default projects/), one job folder, a folder
// holding projects/, or an archive folder on its own (then revisions.yaml is not read).
// Exit 0 when everything checks out; 1 on any finding; 2 when DIR, the key or the firm file cannot be read.
import { parseArgs } from 'node:util';
import { existsSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { audit, type AuditScope } from '../archive/audit.js';
import { archiveSettings, jobArchiveSettings, type ArchiveSettings } from '../archive/location.js';
import { loadPublicKey } from '../archive/sign.js';
import { formatError } from '../load/raw.js';
import { jobFolders } from '../load/jobs.js';

export const VERIFY_USAGE = 'packsmith verify [DIR] [--key FILE.pub] [--archive DIR]';

const isDir = (p: string): boolean => existsSync(p) && statSync(p).isDirectory();
const plural = (n: number, w: string) => `${n} ${w}${n === 1 ? '' : 's'}`;

/** What DIR names: one job, the folder of job folders, a firm's folder holding projects/, or an archive. */
function scopeOf(dir: string, archiveOption: string | null): { scope: AuditScope; settings: ArchiveSettings } {
  if (existsSync(join(dir, 'project.yaml'))) {
    const settings = jobArchiveSettings(dir, archiveOption);
    return { settings, scope: { archive: shown(settings.archive), jobDirs: [dir], complete: false, withRecords: true } };
  }
  const holder = jobFolders(dir).length > 0 ? dir : isDir(join(dir, 'projects')) ? join(dir, 'projects') : null;
  if (holder) {
    const settings = archiveSettings(holder, archiveOption);
    return { settings, scope: { archive: shown(settings.archive), jobDirs: jobFolders(holder), complete: true, withRecords: true } };
  }
  const settings = archiveSettings(dir, archiveOption ?? dir);
  return { settings, scope: { archive: shown(settings.archive), jobDirs: [], complete: true, withRecords: false } };
}

/** A path as the user would type it from here. */
function shown(p: string): string {
  const rel = relative(process.cwd(), p);
  return rel === '' ? '.' : rel.startsWith('..') ? p : rel;
}

export function verifyCommand(args: string[]): 0 | 1 | 2 {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: { key: { type: 'string' }, archive: { type: 'string' } } });
  if (positionals.length > 1) {
    process.stderr.write(`packsmith verify takes one folder\nusage: ${VERIFY_USAGE}\n`);
    return 2;
  }
  const dir = positionals[0] ?? 'projects';
  if (!isDir(dir)) {
    process.stderr.write(`no folder ${dir}: give a job folder, the folder of job folders or an archive folder\nusage: ${VERIFY_USAGE}\n`);
    return 2;
  }
  const { scope, settings } = scopeOf(dir, values.archive ?? null);
  if (settings.errors.length > 0) {
    for (const e of settings.errors) process.stderr.write(`${formatError(e)}\n`);
    return 2;
  }
  const keyFile = values.key ?? settings.publicKey;
  let publicKey = null;
  if (keyFile) {
    const k = loadPublicKey(keyFile);
    if (!k.ok) {
      process.stderr.write(`packsmith verify: ${k.why}\n`);
      return 2;
    }
    publicKey = k.key;
  }
  if (scope.withRecords && !isDir(scope.archive) && scope.jobDirs.length === 0) {
    process.stderr.write(`no job folders in ${dir} and no archive at ${scope.archive}\n`);
    return 2;
  }
  const a = audit(scope, publicKey);
  for (const f of a.findings) process.stdout.write(`${f.path}: ${f.problem}\n`);
  for (const j of a.jobs) for (const l of j.leftovers) process.stdout.write(`${join(scope.archive, j.job, l)}: working folder of an interrupted issue, not a revision (the next issue removes it)\n`);
  if (!scope.withRecords) process.stdout.write(`note: ${scope.archive} checked on its own; give the folder of job folders to check it against each job's revisions.yaml\n`);
  for (const s of a.signers) process.stdout.write(`signed: ${plural(s.revisions, 'revision')} by ${s.firms.join(', ')} with the key ${s.key}\n`);
  if (a.unchecked > 0) process.stdout.write(`not checked: ${plural(a.unchecked, 'signed revision')}, no public key given (--key FILE.pub, or public_key in packsmith.yaml)\n`);
  if (a.unsigned.length > 0 && !publicKey) process.stdout.write(`unsigned: ${a.unsigned.join(', ')} (no firm key: anyone who can write the archive could have written them)\n`);
  const revisions = a.jobs.reduce((n, j) => n + j.revisions.length, 0);
  const what = scope.withRecords ? ` against the records of ${plural(scope.jobDirs.length, 'job folder')}` : '';
  process.stdout.write(`${a.findings.length === 0 ? 'ok' : 'FAILED'}: ${plural(revisions, 'revision')} of ${plural(a.jobs.length, 'job')} in ${scope.archive} checked${what}, ${plural(a.findings.length, 'finding')}\n`);
  return a.findings.length === 0 ? 0 : 1;
}
