// The two sides of the record checked against each other: every revision a job's revisions.yaml
// records must stand in the archive with the same manifest (its SHA-256 is recorded at issue
// time), and every revision in the archive must be recorded. So a revision removed, rolled back
// or replaced, and any edit of revisions.yaml, is a finding.
import { RECORD_FILE, readRecord, recordEntry, revisionDirName, type RecordEntry } from './revisions.js';
import type { Finding, JobArchive } from './verify.js';
import { formatError } from '../load/raw.js';
import { join } from 'node:path';

const FIELDS = ['date', 'by', 'reason', 'input_hash', 'packsmith', 'accepted_open_items', 'manifest_sha256'] as const;

export interface RecordCheck {
  findings: Finding[];
  /** revisions in the archive after the last recorded one, not recorded (an issue interrupted before recording them) */
  unrecorded: number[];
  entries: RecordEntry[];
}

/** `jobDir`'s revisions.yaml against its archive; findings name `jobShown`/revisions.yaml and `archiveShown`/rev-N. */
export function checkRecord(jobDir: string, jobShown: string, archive: JobArchive, archiveShown: string): RecordCheck {
  const at = join(jobShown, RECORD_FILE);
  const rec = readRecord(jobDir);
  if (!rec.ok) return { findings: rec.errors.map((e) => ({ path: at, problem: `unreadable: ${formatError(e)}` })), unrecorded: [], entries: [] };
  const findings: Finding[] = [];
  const held = new Map(archive.revisions.map((r) => [r.number, r]));
  const recorded = new Set<number>();
  for (const e of rec.entries) {
    if (recorded.has(e.revision)) findings.push({ path: at, problem: `records revision ${e.revision} twice` });
    recorded.add(e.revision);
    const r = held.get(e.revision);
    if (!r) {
      findings.push({ path: at, problem: `records revision ${e.revision}, which ${archiveShown} does not hold: removed or rolled back; restore ${revisionDirName(e.revision)} from a copy` });
      continue;
    }
    const want = recordEntry(r.manifest, r.manifestSha);
    if (e.manifest_sha256 === null) {
      findings.push({ path: at, problem: `revision ${e.revision} has no manifest_sha256 (recorded by an earlier packsmith); packsmith archive move-from records it` });
    }
    for (const f of FIELDS) {
      if (f === 'manifest_sha256' && e.manifest_sha256 === null) continue;
      if (e[f] !== want[f]) {
        const what = f === 'manifest_sha256' ? 'its manifest was replaced or altered, or the record was' : 'the record or the manifest was altered';
        findings.push({ path: at, problem: `revision ${e.revision}: ${f} is ${JSON.stringify(e[f])}, ${revisionDirName(e.revision)} says ${JSON.stringify(want[f])} (${what})` });
      }
    }
  }
  const lastRecorded = Math.max(0, ...recorded);
  const unrecorded: number[] = [];
  for (const r of archive.revisions) {
    if (recorded.has(r.number)) continue;
    if (r.number > lastRecorded) unrecorded.push(r.number);
    findings.push({ path: join(archiveShown, revisionDirName(r.number)), problem: `not recorded in ${at}${r.number > lastRecorded ? ' (an issue interrupted before recording it: the next packsmith issue records it)' : ''}` });
  }
  return { findings, unrecorded, entries: rec.entries };
}
