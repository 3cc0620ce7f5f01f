// `packsmith check <job-folder> [--json] [--explain]`: validate and assess one job, print the table or the JSON.
// Exit 0 nothing failed or unverified; 1 a check failed or is not verified; 2 invalid input.
import { parseArgs } from 'node:util';
import { loadJob } from '../job.js';
import { formatError } from '../load/raw.js';
import { assessmentText } from '../render/text.js';
import { missingFolder } from './folders.js';
import { placeholders } from './placeholders.js';
import { today } from './today.js';
import { boardJson } from '../calc/tree/json.js';

export function checkCommand(args: string[]): 0 | 1 | 2 {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: { json: { type: 'boolean' }, explain: { type: 'boolean' } } });
  const dir = positionals[0]!;
  const missing = missingFolder(dir, 'job folder');
  if (missing) {
    process.stderr.write(`${missing}\n`);
    return 2;
  }
  const job = loadJob(dir, { today: today() });
  if (!job.ok) {
    for (const e of job.errors) process.stderr.write(`${formatError(e)}\n`);
    process.stderr.write(`${job.errors.length} problem${job.errors.length === 1 ? '' : 's'} in ${job.raw.name}; nothing was assessed\n`);
    if (values.json) process.stdout.write(`${JSON.stringify({ job: job.raw.name, errors: job.errors }, null, 2)}\n`);
    return 2;
  }
  const a = job.assessment;
  if (values.json) {
    const { overrides, ...rules } = a.rules;
    process.stdout.write(`${JSON.stringify({ job: a.job, rules: { ...rules, overrides }, ...(a.boards ? { boards: a.boards.map(boardJson) } : {}), circuits: a.circuits, summary: a.summary, departures: a.departures }, null, 2)}\n`);
  } else {
    process.stdout.write(assessmentText(a, { explain: values.explain ?? false, width: Math.max(60, Math.min(process.stdout.columns ?? 100, 120)) }));
  }
  const unfilled = placeholders(job.raw.files.get('project.yaml')?.toString('utf8'));
  for (const line of unfilled) process.stderr.write(`${line}\n`);
  if (unfilled.length > 0) process.stderr.write(`${unfilled.length} value${unfilled.length === 1 ? '' : 's'} of project.yaml still to fill in: the job is not ready\n`);
  return a.summary.fail > 0 || a.summary['not-verified'] > 0 || unfilled.length > 0 ? 1 : 0;
}
