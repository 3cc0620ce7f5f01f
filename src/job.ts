// Read, validate and assess one job folder: the first three stages in one call.
import { readJob } from './load/job.js';
import type { LocatedError, RawJob } from './load/raw.js';
import { validate, type Project } from './model/validate.js';
import { assess } from './calc/assess.js';
import { CALC_RULES, PROJECT_RULES } from './calc/inputs.js';
import type { Assessment } from './calc/types.js';

export type LoadedJob =
  | { ok: true; raw: RawJob; project: Project; assessment: Assessment }
  | { ok: false; raw: RawJob; errors: LocatedError[] };

/** `today` (YYYY-MM-DD, read from the clock by the command line) makes a test session dated later an error. */
export function loadJob(dir: string, opts: { today?: string } = {}): LoadedJob {
  const raw = readJob(dir);
  const v = validate(raw, CALC_RULES, PROJECT_RULES, opts);
  if (!v.ok) return { ok: false, raw, errors: v.errors };
  return { ok: true, raw, project: v.project, assessment: assess(v.project) };
}
