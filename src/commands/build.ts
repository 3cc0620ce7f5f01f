// `packsmith build [job-folder...] [--out DIR] [--force] [--theme DIR] [--paper A4|Letter] [--archive DIR]`:
// draft packs into DIR/<job>/draft/ and the site DIR/index.html. Exit 0 built; 2 invalid input.
import { parseArgs } from 'node:util';
import { existsSync, statSync } from 'node:fs';
import { PAPER } from '../model/schema.js';
import { missingFolder } from './folders.js';
import { today } from './today.js';

export async function buildCommand(args: string[]): Promise<0 | 2> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      out: { type: 'string', default: 'out' }, force: { type: 'boolean', default: false },
      theme: { type: 'string' }, paper: { type: 'string' }, archive: { type: 'string' },
    },
  });
  const missing = positionals.map((j) => missingFolder(j, 'job folder')).filter((m) => m !== null);
  if (missing.length > 0) {
    for (const m of missing) process.stderr.write(`${m}\n`);
    return 2;
  }
  const { build, defaultJobs } = await import('../build.js');
  const { NO_CHROMIUM_HELP } = await import('../print/browser.js');
  const jobs = positionals.length ? positionals : defaultJobs();
  if (jobs.length === 0) {
    process.stderr.write('packsmith: no job folders given and none found under projects/\n');
    return 2;
  }
  const paper = values.paper === undefined ? undefined : PAPER.find((p) => p.toLowerCase() === values.paper!.toLowerCase());
  if (values.paper !== undefined && paper === undefined) {
    process.stderr.write(`packsmith: --paper "${values.paper}": expected ${PAPER.join(' or ')}\n`);
    return 2;
  }
  if (values.theme !== undefined && !(existsSync(values.theme) && statSync(values.theme).isDirectory())) {
    process.stderr.write(`packsmith: --theme "${values.theme}": no such folder; expected a folder of templates, partials, pack.css, theme.css or a logo\n`);
    return 2;
  }
  const r = await build({ jobs, out: values.out!, force: values.force!, theme: values.theme ?? null, archive: values.archive ?? null, today: today(), ...(paper ? { paper } : {}) });
  for (const b of r.built) process.stdout.write(`${b.job}: ${b.html}${b.pdf ? `\n${b.job}: ${b.pdf}` : ''}\n`);
  for (const s of r.skipped) process.stdout.write(`${s.job}: unchanged, kept ${s.dir}\n`);
  if (r.pdfSkipped) process.stderr.write(`${NO_CHROMIUM_HELP}\n`);
  return r.invalid.length > 0 ? 2 : 0;
}
