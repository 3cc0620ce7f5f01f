// Where packsmith writes: only inside the output folder (--out), which must be empty, new, or a
// folder packsmith made (marked by OUT_MARK, or holding only what packsmith writes), never a
// filesystem root. Inside it, every folder on the way to a file is a real folder: a symlink there
// was not made by packsmith (it makes none) and is refused, never followed.
import { existsSync, lstatSync, mkdirSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { join, parse, resolve } from 'node:path';
import { isWorkingName, writeReplacing } from './files.js';

/** The file that marks a folder as packsmith's output. */
export const OUT_MARK = '.packsmith-out';
const MARK_TEXT = 'This folder is written by packsmith (drafts and the archive site). It may be deleted and rebuilt.\n';

export class OutputFolderError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'OutputFolderError';
  }
}

/** What packsmith itself puts directly in its output folder. */
const OWN_NAMES = new Set(['index.html', OUT_MARK]);

/** A job folder of the output: only drafts, revisions, the job's page and working files. */
function looksLikeJobOutput(dir: string): boolean {
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return false;
  }
  return names.length > 0 && names.every((n) => n === 'draft' || n === 'index.html' || /^rev-\d+$/.test(n) || isWorkingName(n));
}

/**
 * The output folder, checked (nothing is written until outDir): its real path. Refused
 * (OutputFolderError) when it is a filesystem root, not a folder, or a folder holding anything
 * packsmith did not write.
 */
export function claimOut(dir: string): string {
  const given = resolve(dir);
  if (parse(given).root === given) throw new OutputFolderError(`--out "${dir}" is the root of a filesystem; give a folder of its own, e.g. out/`);
  if (!existsSync(given)) return given;
  if (!statSync(given).isDirectory()) {
    throw new OutputFolderError(`--out "${dir}" is a file; give a folder (a new or empty one, or one packsmith wrote before)`);
  }
  const real = realpathSync(given);
  if (parse(real).root === real) throw new OutputFolderError(`--out "${dir}" leads to the root of a filesystem; give a folder of its own, e.g. out/`);
  const names = readdirSync(real);
  if (!names.includes(OUT_MARK)) {
    const foreign = names.filter((n) => !OWN_NAMES.has(n) && !isWorkingName(n) && !looksLikeJobOutput(join(real, n)));
    if (foreign.length > 0) {
      throw new OutputFolderError(`--out "${dir}" holds files packsmith did not write (${foreign.slice(0, 5).join(', ')}${foreign.length > 5 ? ', ...' : ''}); packsmith writes only into a new or empty folder, or one it wrote before: give another folder`);
    }
  }
  return real;
}

/**
 * The folder `out/segments...`, made where missing, each step a real folder: a symlink (or a
 * file) on the way is refused, never followed.
 */
export function outDir(out: string, ...segments: string[]): string {
  mkdirSync(out, { recursive: true });
  if (!existsSync(join(out, OUT_MARK))) writeReplacing(join(out, OUT_MARK), MARK_TEXT);
  let path = out;
  for (const segment of segments) {
    if (segment === '' || segment === '.' || segment === '..' || segment.includes('/') || segment.includes('\\')) {
      throw new OutputFolderError(`cannot write to "${segment}" inside ${out}: not a plain folder name`);
    }
    path = join(path, segment);
    let st;
    try {
      st = lstatSync(path);
    } catch {
      mkdirSync(path);
      continue;
    }
    if (st.isSymbolicLink()) throw new OutputFolderError(`${path} is a symlink, which packsmith did not make; it writes only into real folders inside the output folder: remove the link and run again`);
    if (!st.isDirectory()) throw new OutputFolderError(`${path} is a file where packsmith keeps a folder; move it away and run again`);
  }
  return path;
}
