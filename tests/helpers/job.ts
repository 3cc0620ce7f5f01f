// A demo job copied into a scratch firm folder (<scratch>/projects/<job>), to break on purpose.
import { cpSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { readJob } from '../../src/load/job.js';
import { validate } from '../../src/model/validate.js';
import { CALC_RULES } from '../../src/calc/inputs.js';
import { formatError } from '../../src/load/raw.js';
import { ROOT } from './cli.js';
import { scratch } from './archive.js';

export const DEMO = 'tannery-row-refit';

/** Copy projects/<name> to <scratch>/projects/<as>; returns the job folder. */
export function demoCopy(name = DEMO, as = name): string {
  const firm = scratch('hostile');
  const dest = join(firm, 'projects', as);
  cpSync(join(ROOT, 'projects', name), dest, { recursive: true });
  return dest;
}

export function write(job: string, file: string, text: string | Uint8Array): void {
  writeFileSync(join(job, file), text);
}

export function replaceIn(job: string, file: string, from: string, to: string): void {
  const text = readFileSync(join(job, file), 'utf8');
  if (!text.includes(from)) throw new Error(`"${from}" is not in ${file}`);
  writeFileSync(join(job, file), text.replace(from, to));
}

/** The job's errors as `file:row:column: message` lines (none when it validates). */
export function errorsOf(job: string): string[] {
  const v = validate(readJob(job), CALC_RULES);
  return v.ok ? [] : v.errors.map(formatError);
}
