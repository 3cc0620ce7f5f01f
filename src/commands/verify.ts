// `packsmith verify [DIR]`: re-hash every issued revision in the archive against its manifest.
// Exit 0 when everything checks out; 1 on any finding; 2 when DIR is not there.
import { parseArgs } from 'node:util';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { verifyArchive } from '../archive/verify.js';
import { staleWorking } from '../archive/files.js';

export const VERIFY_USAGE = 'packsmith verify [DIR]';

export function verifyCommand(args: string[]): 0 | 1 | 2 {
  const { positionals } = parseArgs({ args, allowPositionals: true, options: {} });
  if (positionals.length > 1) {
    process.stderr.write(`packsmith verify takes one archive folder\nusage: ${VERIFY_USAGE}\n`);
    return 2;
  }
  const dir = positionals[0] ?? 'out';
  if (!existsSync(dir)) {
    process.stderr.write(`no archive at ${dir}: nothing was built or issued there\n`);
    return 2;
  }
  const { jobs, findings } = verifyArchive(dir);
  for (const f of findings) process.stdout.write(`${join(dir, f.path)}: ${f.problem}\n`);
  const leftovers = jobs.flatMap((j) => staleWorking(j.dir).map((n) => join(dir, j.job, n)));
  for (const l of leftovers) process.stdout.write(`${l}: working folder of an interrupted issue, not a revision (the next issue removes it)\n`);
  const revisions = jobs.reduce((n, j) => n + j.revisions.length, 0);
  const plural = (n: number, w: string) => `${n} ${w}${n === 1 ? '' : 's'}`;
  process.stdout.write(`${findings.length === 0 ? 'ok' : 'FAILED'}: ${plural(revisions, 'revision')} of ${plural(jobs.length, 'job')} checked, ${plural(findings.length, 'finding')}\n`);
  return findings.length === 0 ? 0 : 1;
}
