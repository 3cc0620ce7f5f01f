// Read, validate and assess one job folder: the first three stages in one call.
import { readJob } from './load/job.js';
import type { LocatedError, RawJob } from './load/raw.js';
import { validate, type Project } from './model/validate.js';
import { assess } from './calc/assess.js';
import { inputProblems } from './calc/inputs.js';
import type { Assessment } from './calc/types.js';

export type LoadedJob =
  | { ok: true; raw: RawJob; project: Project; assessment: Assessment }
  | { ok: false; raw: RawJob; errors: LocatedError[] };

export function loadJob(dir: string): LoadedJob {
  const raw = readJob(dir);
  const v = validate(raw);
  if (!v.ok) return { ok: false, raw, errors: v.errors };
  const problems = inputProblems(v.project);
  if (problems.length > 0) {
    const column = (field: string) => raw.circuits?.header.find((h) => h.text === field)?.column ?? 1;
    return {
      ok: false,
      raw,
      errors: problems.map((p) => ({ file: 'circuits.csv', row: p.row, column: column(p.field), message: `${p.field}: ${p.message}` })),
    };
  }
  return { ok: true, raw, project: v.project, assessment: assess(v.project) };
}
