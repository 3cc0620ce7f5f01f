// `verify` over a whole record: the job folders (their revisions.yaml) and the archive, checked
// both ways, and every revision's signature. A job folder's record and the archive must agree;
// an archive folder no job folder records, and anything hidden in the archive, are findings.
import { basename, join } from 'node:path';
import type { KeyObject } from 'node:crypto';
import { inspectJob, walkArchive, type Finding, type JobArchive } from './verify.js';
import { checkRecord } from './record.js';
import { revisionDirName } from './revisions.js';

export interface AuditScope {
  /** the archive folder, as given or found (paths in findings start with it) */
  archive: string;
  /** job folders whose revisions.yaml is checked against the archive, as given */
  jobDirs: string[];
  /** true when jobDirs are every job folder of their folder: an archive job none of them records is then a finding */
  complete: boolean;
  /** false when no job folder is known (an archive checked on its own): revisions.yaml is not read */
  withRecords: boolean;
}

export interface Signer {
  key: string;
  firms: string[];
  revisions: number;
}

export interface Audit {
  jobs: JobArchive[];
  findings: Finding[];
  /** "job/rev-N" of every unsigned revision */
  unsigned: string[];
  /** signatures that checked out, by key */
  signers: Signer[];
  /** revisions signed, but not checked because no public key was given */
  unchecked: number;
}

export function audit(scope: AuditScope, publicKey: KeyObject | null): Audit {
  const opts = { publicKey };
  const findings: Finding[] = [];
  const at = (f: Finding): Finding => ({ path: join(scope.archive, f.path), problem: f.problem });
  const walk = walkArchive(scope.archive);
  const names = new Set(scope.jobDirs.map((d) => basename(d)));
  const inspect = new Set(scope.withRecords && !scope.complete ? names : walk.jobs);
  if (scope.withRecords) for (const n of names) inspect.add(n);
  if (scope.complete || !scope.withRecords) findings.push(...walk.findings.map(at));
  const jobs = [...inspect].sort().map((j) => inspectJob(scope.archive, j, opts));
  for (const j of jobs) findings.push(...j.findings.map(at));
  if (scope.withRecords) {
    const byName = new Map(jobs.map((j) => [j.job, j])); // one look-up per job folder, not a search of every job
    for (const dir of scope.jobDirs) {
      const j = byName.get(basename(dir))!;
      findings.push(...checkRecord(dir, dir, j, join(scope.archive, j.job)).findings);
    }
    if (scope.complete) {
      for (const j of jobs) {
        if (!names.has(j.job) && j.revisions.length > 0) {
          findings.push({ path: join(scope.archive, j.job), problem: `${j.revisions.length} revision(s) of a job with no job folder beside the others to record them (its revisions.yaml is gone)` });
        }
      }
    }
  }
  const unsigned: string[] = [];
  const signers = new Map<string, Signer>();
  let unchecked = 0;
  for (const j of jobs) {
    for (const r of j.revisions) {
      if (r.signature === null) unsigned.push(`${j.job}/${revisionDirName(r.number)}`);
      else if (r.signature.status === 'unchecked') unchecked += 1;
      else if (r.signature.status === 'valid') {
        const s = signers.get(r.signature.key) ?? { key: r.signature.key, firms: [], revisions: 0 };
        if (!s.firms.includes(r.manifest.firm)) s.firms.push(r.manifest.firm);
        s.revisions += 1;
        signers.set(s.key, s);
      }
    }
  }
  return { jobs: jobs.filter((j) => j.revisions.length > 0 || j.findings.length > 0), findings, unsigned, signers: [...signers.values()], unchecked };
}
