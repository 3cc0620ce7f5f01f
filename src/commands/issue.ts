// `packsmith issue <job-folder> --by NAME [--date YYYY-MM-DD] [--reason TEXT] [--accept-open-items] [--out DIR] [--archive DIR] [--key FILE]`
// Exit 0 issued; 1 refused (nothing changed, open items, the archive does not check out); 2 invalid input.
import { parseArgs } from 'node:util';
import { relative } from 'node:path';
import { issueRevision } from '../issue.js';
import { missingFolder } from './folders.js';

import { today } from './today.js';

export const ISSUE_USAGE = 'packsmith issue <job-folder> --by NAME [--date YYYY-MM-DD] [--reason TEXT] [--accept-open-items] [--out DIR] [--archive DIR] [--key FILE]';

export async function issueCommand(args: string[]): Promise<0 | 1 | 2> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      by: { type: 'string' },
      date: { type: 'string' },
      reason: { type: 'string' },
      'accept-open-items': { type: 'boolean', default: false },
      out: { type: 'string', default: 'out' },
      archive: { type: 'string' },
      key: { type: 'string' },
    },
  });
  if (positionals.length !== 1 || values.by === undefined) {
    process.stderr.write(`packsmith issue needs one job folder and --by NAME\nusage: ${ISSUE_USAGE}\n`);
    return 2;
  }
  const missing = missingFolder(positionals[0]!, 'job folder');
  if (missing) {
    process.stderr.write(`${missing}\n`);
    return 2;
  }
  const r = await issueRevision({
    job: positionals[0]!,
    out: values.out!,
    by: values.by,
    date: values.date ?? today(),
    reason: values.reason ?? null,
    acceptOpenItems: values['accept-open-items']!,
    archive: values.archive ?? null,
    key: values.key ?? (process.env.PACKSMITH_KEY || null),
    today: today(),
  });
  if (!r.ok) {
    for (const line of r.reasons) process.stderr.write(`${line}\n`);
    return r.code;
  }
  const rel = relative(process.cwd(), r.dir);
  const shown = rel && !rel.startsWith('..') ? rel : r.dir;
  process.stdout.write(`issued Revision ${r.revision} into ${shown}/\n`);
  for (const f of r.files) process.stdout.write(`  ${shown}/${f}\n`);
  if (r.openItems > 0) process.stdout.write(`  ${r.openItems} open item${r.openItems === 1 ? '' : 's'} accepted; the pack lists them first\n`);
  if (r.signedWith) process.stdout.write(`  signed with the key ${r.signedWith}\n`);
  for (const n of r.notes) process.stdout.write(`  ${n}\n`);
  return 0;
}
