// A cheap guess, before a build looks at its jobs properly, at whether any pack will need printing:
// a job with no draft stamp, or with an input file modified after its stamp was written. Only a
// hint for starting Chromium early (its start takes seconds; looking at a thousand jobs by content
// hash takes about as long): whether a job is rebuilt is still decided by the content hash.
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { STAMP_FILE } from './fingerprint.js';

/** The files a job's draft is made from, as far as a glance can tell (the firm file is left out: a change there is found by the build itself). */
const INPUTS = ['project.yaml', 'circuits.csv', 'notes.md'];

/** Modification time in ms, or null where the file cannot be seen. */
function mtimeOf(path: string): number | null {
  try {
    return statSync(path).mtimeMs;
  } catch {
    return null;
  }
}

/** Whether the draft in `draftDir` may be out of date with the job folder `jobDir`, by modification times alone. */
export function mayHaveChanged(jobDir: string, draftDir: string): boolean {
  const stamped = mtimeOf(join(draftDir, STAMP_FILE));
  if (stamped === null) return true;
  const newer = (path: string) => (mtimeOf(path) ?? 0) > stamped;
  if (newer(jobDir) || INPUTS.some((f) => newer(join(jobDir, f)))) return true; // the folder itself: a file added or removed
  const readings = join(jobDir, 'readings');
  if (newer(readings)) return true; // a reading file added or removed
  try {
    return readdirSync(readings).some((f) => newer(join(readings, f)));
  } catch {
    return false;
  }
}
