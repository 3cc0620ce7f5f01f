// Confined reading: packsmith reads only inside the folders it was given (the job folder, the
// firm's folder, the theme folder), never through a symlink that leaves them, only regular files
// (a FIFO or a device would hang or flood the read), and only files of a sane size.
import { lstatSync, readFileSync, realpathSync, statSync } from 'node:fs';
import { isAbsolute, join, relative, resolve } from 'node:path';

/** The largest input file packsmith reads: far above any job's, far below what would exhaust memory. */
export const MAX_INPUT_BYTES = 16 * 1024 * 1024;

/** Whether `path` (already real, or resolved) lies inside `folder` (or is it). */
export function isInside(folder: string, path: string): boolean {
  const rel = relative(folder, path);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/** The real path of a folder, or the resolved path where it does not exist. */
export function realFolder(dir: string): string {
  try {
    return realpathSync(resolve(dir));
  } catch {
    return resolve(dir);
  }
}

export type ConfinedFile =
  | { kind: 'missing' }
  | { kind: 'file'; path: string }
  | { kind: 'refused'; message: string };

/** The real path of `rel` inside `root` (links followed), and whether it stays inside `root`. */
function realInside(root: string, rel: string, noun: 'file' | 'folder', what: string):
  { kind: 'missing' } | { kind: 'refused'; message: string } | { kind: 'real'; path: string; inside: boolean } {
  const path = join(root, rel);
  try {
    lstatSync(path);
  } catch {
    return { kind: 'missing' };
  }
  let real: string;
  try {
    real = realpathSync(path);
  } catch {
    return { kind: 'refused', message: `a link to nothing (a broken symlink); put the ${noun} itself in ${what}` };
  }
  return { kind: 'real', path: real, inside: isInside(realFolder(root), real) };
}

/**
 * Where `rel` inside `root` may be read from: a regular file whose real path is inside `root`.
 * `what` names the folder in messages ("the job folder", "the theme folder").
 */
export function confinedFile(root: string, rel: string, what: string): ConfinedFile {
  const r = realInside(root, rel, 'file', what);
  if (r.kind !== 'real') return r;
  if (!r.inside) {
    return { kind: 'refused', message: `a link to a file outside ${what}; packsmith reads only files inside ${what}: copy the file in instead of linking to it` };
  }
  const real = r.path;
  const st = statSync(real);
  if (st.isDirectory()) return { kind: 'refused', message: 'a folder where a file was expected' };
  if (!st.isFile()) return { kind: 'refused', message: 'not a regular file (a device, pipe or socket); put a plain file here' };
  if (st.size > MAX_INPUT_BYTES) return { kind: 'refused', message: `${st.size} bytes: far larger than any job file (at most ${MAX_INPUT_BYTES}); is this the right file?` };
  return { kind: 'file', path: real };
}

/** Read a confined file's bytes, or null when missing; throws a message when refused. */
export function readConfined(root: string, rel: string, what: string): Buffer | null {
  const f = confinedFile(root, rel, what);
  if (f.kind === 'missing') return null;
  if (f.kind === 'refused') throw new Error(`${rel}: ${f.message}`);
  return readFileSync(f.path);
}

/** A sub-folder of `root` that may be listed: its real path inside `root`. */
export function confinedFolder(root: string, rel: string, what: string): { kind: 'missing' } | { kind: 'folder'; path: string } | { kind: 'refused'; message: string } {
  const r = realInside(root, rel, 'folder', what);
  if (r.kind !== 'real') return r;
  const real = r.path;
  if (!r.inside) return { kind: 'refused', message: `a link to a folder outside ${what}; packsmith reads only inside ${what}` };
  if (!statSync(real).isDirectory()) return { kind: 'refused', message: `a file where a folder was expected` };
  return { kind: 'folder', path: real };
}
