// `packsmith build [job-folder...] [--out DIR] [--force] [--theme DIR] [--paper A4|Letter] [--archive DIR] [--shard K/N]`:
// draft packs into DIR/<job>/draft/ and the site DIR/index.html. Exit 0 built; 2 invalid input.
// `packsmith build --site --out DIR [shard-out...]`: join shards' output folders into DIR and write the site.
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
      shard: { type: 'string' }, site: { type: 'boolean', default: false },
    },
  });
  if (values.site) return siteOnly(values.out!, positionals);
  const missing = positionals.map((j) => missingFolder(j, 'job folder')).filter((m) => m !== null);
  if (missing.length > 0) {
    for (const m of missing) process.stderr.write(`${m}\n`);
    return 2;
  }
  const { build, defaultJobs } = await import('../build.js');
  const { NO_CHROMIUM_HELP } = await import('../print/browser.js');
  const all = positionals.length ? positionals : defaultJobs();
  const { parseShard, shardOf } = await import('../archive/shard.js');
  const shard = values.shard === undefined ? null : parseShard(values.shard);
  if (typeof shard === 'string') {
    process.stderr.write(`packsmith: ${shard}\n`);
    return 2;
  }
  const jobs = shard ? all.filter((j) => shardOf(j, shard.n) === shard.k) : all;
  if (all.length === 0) {
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
  const r = await build({ jobs, out: values.out!, force: values.force!, site: shard === null, theme: values.theme ?? null, archive: values.archive ?? null, today: today(), ...(paper ? { paper } : {}) });
  for (const b of r.built) process.stdout.write(`${b.job}: ${b.html}${b.pdf ? `\n${b.job}: ${b.pdf}` : ''}\n`);
  for (const s of r.skipped) process.stdout.write(`${s.job}: unchanged, kept ${s.dir}\n`);
  if (r.pdfSkipped) process.stderr.write(`${NO_CHROMIUM_HELP}\n`);
  return r.invalid.length > 0 ? 2 : 0;
}

/** `build --site`: join the shards' output folders (if any) into `out`, then write its site. */
async function siteOnly(out: string, shards: string[]): Promise<0 | 2> {
  const missing = shards.map((s) => missingFolder(s, 'shard output folder')).filter((m) => m !== null);
  if (missing.length > 0) {
    for (const m of missing) process.stderr.write(`${m}\n`);
    return 2;
  }
  const { joinShards } = await import('../archive/shard.js');
  const r = joinShards(out, shards);
  if ('error' in r) {
    process.stderr.write(`packsmith: ${r.error}\n`);
    return 2;
  }
  process.stdout.write(`site: ${r.jobs.length} job(s) in ${out}/index.html\n`);
  return 0;
}
