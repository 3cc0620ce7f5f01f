// `packsmith archive move-from <out-dir> [JOBS-DIR] [--archive DIR]`: move revisions issued into
// <out-dir>/<job>/rev-N/ by an earlier packsmith into each job's archive folder (archive/ beside
// JOBS-DIR, default projects/, or the firm file's `archive`), and record their manifests' SHA-256
// in revisions.yaml. Exit 0 all moved (or nothing to move); 1 something was left where it was; 2 usage.
import { parseArgs } from 'node:util';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import { archiveSettings } from '../archive/location.js';
import { moveRevisions } from '../archive/move.js';
import { jobFolders } from '../load/jobs.js';
import { formatError } from '../load/raw.js';

export const ARCHIVE_USAGE = 'packsmith archive move-from <out-dir> [jobs-folder] [--archive DIR]';

export function archiveCommand(args: string[]): 0 | 1 | 2 {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: { archive: { type: 'string' } } });
  const [sub, out, holderArg] = positionals;
  if (sub !== 'move-from' || !out || positionals.length > 3) {
    process.stderr.write(`usage: ${ARCHIVE_USAGE}\n`);
    return 2;
  }
  const holder = holderArg ?? 'projects';
  if (!existsSync(out) || !statSync(out).isDirectory()) {
    process.stderr.write(`no folder ${out}\nusage: ${ARCHIVE_USAGE}\n`);
    return 2;
  }
  const settings = archiveSettings(holder, values.archive ?? null);
  if (settings.errors.length > 0) {
    for (const e of settings.errors) process.stderr.write(`${formatError(e)}\n`);
    return 2;
  }
  const folders = new Map(jobFolders(holder).map((d) => [basename(d), d]));
  const names = readdirSync(out, { withFileTypes: true }).filter((e) => e.isDirectory() && !e.name.startsWith('.')).map((e) => e.name).sort();
  const r = moveRevisions(out, names.map((name) => ({ name, dir: folders.get(name) ?? null, archive: settings.archive })));
  for (const m of r.moved) process.stdout.write(`moved ${m}\n`);
  for (const m of r.same) process.stdout.write(`already in the archive, removed from ${out}: ${m}\n`);
  for (const m of r.recorded) process.stdout.write(`recorded manifest_sha256: ${m}\n`);
  for (const p of r.problems) process.stderr.write(`${p}\n`);
  for (const name of names) {
    if (!folders.has(name) && existsSync(join(settings.archive, name))) process.stderr.write(`${name}: no job folder in ${holder}; its revisions.yaml was not updated\n`);
  }
  if (r.moved.length + r.same.length === 0 && r.problems.length === 0) process.stdout.write(`nothing to move: ${out} holds no issued revisions\n`);
  else process.stdout.write(`the archive is ${settings.archive}; rebuild the site with packsmith build\n`);
  return r.problems.length > 0 ? 1 : 0;
}
