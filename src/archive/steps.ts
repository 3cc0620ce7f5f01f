// The named steps of `issue`, and a seam for the interruption tests: with PACKSMITH_STOP_AT set to
// a step's name (or several, comma-separated), packsmith says "packsmith: stopped at <step>" on
// stderr and stops itself (SIGSTOP) the first time it reaches that step, so a test can kill it
// exactly there or let it go on (SIGCONT). Unset, a step does nothing.
import { writeSync } from 'node:fs';

export const ISSUE_STEPS = [
  'loaded',          // job validated, archive read, the gates passed
  'rendered',        // the pack's HTML made in memory
  'staging',         // the working folder created, empty
  'wrote-html',
  'printed',         // the PDF printed and its metadata set, in memory
  'wrote-pdf',
  'wrote-data',
  'wrote-manifest',
  'sealed',          // the working folder's files made read-only
  'committing',      // just before the working folder is renamed to rev-N
  'committed',       // rev-N in place
  'recording',       // revisions.yaml's replacement written, not yet renamed
  'recorded',        // revisions.yaml replaced
  'done',            // the archive site written
] as const;
export type IssueStep = (typeof ISSUE_STEPS)[number];

const pending = new Set((process.env.PACKSMITH_STOP_AT ?? '').split(',').map((s) => s.trim()).filter(Boolean));

export function step(name: IssueStep): void {
  if (!pending.delete(name)) return;
  writeSync(2, `packsmith: stopped at ${name}\n`);
  process.kill(process.pid, 'SIGSTOP');
}
