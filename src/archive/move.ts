// Moving revisions issued before the archive had a place of its own (out/<job>/rev-N/) into the
// job's archive folder, and recording each manifest's SHA-256 in the job's revisions.yaml where
// an earlier packsmith did not. A revision is moved whole (renamed, or copied, checked and then
// removed across file systems); one that does not check out, or whose number the archive already
// holds with other contents, is left where it is and reported.
import { cpSync, existsSync, mkdirSync, renameSync } from 'node:fs';
import { join } from 'node:path';
import { inspectJob } from './verify.js';
import { fsyncDir, removeWorking, seal } from './files.js';
import { readRecord, recordEntry, revisionDirName, writeRecord } from './revisions.js';
import { sha256 } from './hash.js';
import { readFileSync } from 'node:fs';

export interface MoveReport {
  moved: string[];
  /** already in the archive with the same manifest: the copy in out/ removed */
  same: string[];
  problems: string[];
  recorded: string[];
}

function moveFolder(from: string, to: string): void {
  try {
    renameSync(from, to);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== 'EXDEV') throw e;
    cpSync(from, to, { recursive: true, errorOnExist: true, force: false });
    seal(to);
    removeWorking(from);
  }
}

/** Move every rev-N of `outJobs` (job name → its folder in out/) into `archive`/<job>/ and record manifest hashes in the job folders. */
export function moveRevisions(out: string, jobs: { name: string; dir: string | null; archive: string }[]): MoveReport {
  const report: MoveReport = { moved: [], same: [], problems: [], recorded: [] };
  for (const job of jobs) {
    const source = inspectJob(out, job.name);
    if (source.revisions.length === 0 && source.findings.length === 0) continue;
    const wrong = source.findings.filter((f) => /^.+\/rev-\d+/.test(f.path));
    if (wrong.length > 0) {
      report.problems.push(`${join(out, job.name)}: not moved, it does not check out:`, ...wrong.map((f) => `  ${join(out, f.path)}: ${f.problem}`));
      continue;
    }
    const target = join(job.archive, job.name);
    mkdirSync(target, { recursive: true });
    const there = inspectJob(job.archive, job.name);
    for (const r of source.revisions) {
      const name = revisionDirName(r.number);
      const dest = join(target, name);
      const held = there.revisions.find((x) => x.number === r.number);
      if (held && held.manifestSha === r.manifestSha) {
        removeWorking(r.dir);
        report.same.push(dest);
      } else if (held || existsSync(dest)) {
        report.problems.push(`${r.dir}: not moved, ${dest} already holds another revision ${r.number}`);
      } else {
        moveFolder(r.dir, dest);
        report.moved.push(dest);
      }
    }
    fsyncDir(target);
    if (!job.dir) continue;
    const rec = readRecord(job.dir);
    if (!rec.ok) {
      report.problems.push(`${join(job.dir, 'revisions.yaml')}: unreadable, not updated`);
      continue;
    }
    const now = inspectJob(job.archive, job.name).revisions;
    let changed = false;
    const entries = rec.entries.map((e) => {
      const r = now.find((x) => x.number === e.revision);
      if (!r || e.manifest_sha256 !== null) return e;
      const want = recordEntry(r.manifest, r.manifestSha);
      const same = e.date === want.date && e.by === want.by && e.input_hash === want.input_hash && e.reason === want.reason;
      if (!same) {
        report.problems.push(`${join(job.dir!, 'revisions.yaml')}: revision ${e.revision} differs from its manifest; its manifest_sha256 was not recorded`);
        return e;
      }
      changed = true;
      report.recorded.push(`${join(job.dir!, 'revisions.yaml')}: revision ${e.revision}`);
      return { ...e, manifest_sha256: sha256(readFileSync(join(r.dir, 'manifest.json'))) };
    });
    if (changed) writeRecord(job.dir, entries);
  }
  return report;
}
