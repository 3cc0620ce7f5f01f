// Confined reading: packsmith reads only inside the folders it was given (the job folder, the
// firm's folder, the theme folder), never through a symlink that leaves them, only regular files
// (a FIFO or a device would hang or flood the read), and only files of a sane size.
//
// A folder's real path is looked up once (`confinedTo`), then each file costs one realpath (the
// system's, not node's walk of every path component), one stat and its read.
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
    return realpathSync.native(resolve(dir));
  } catch {
    return resolve(dir);
  }
}

export type ConfinedFile =
  | { kind: 'missing' }
  | { kind: 'file'; path: string }
  | { kind: 'refused'; message: string };

export type ConfinedFolder = { kind: 'missing' } | { kind: 'folder'; path: string } | { kind: 'refused'; message: string };

/** Reading inside one folder: its real path looked up once, for every file read in it. */
export interface Confined {
  /** Where `rel` may be read from: a regular file whose real path is inside the folder. */
  file(rel: string): ConfinedFile;
  /** A confined file's bytes, or null when missing; throws `rel: message` when refused. */
  read(rel: string): Buffer | null;
  /** A sub-folder that may be listed: its real path inside the folder. */
  folder(rel: string): ConfinedFolder;
}

/** Reading inside `root`; `what` names the folder in messages ("the job folder", "the theme folder"). */
export function confinedTo(root: string, what: string): Confined {
  const base = resolve(root);
  let real: string | null = null;
  const realRoot = () => (real ??= realFolder(base));
  /** The real path of `rel` (links followed), and whether it stays inside the folder. */
  const realInside = (rel: string, noun: 'file' | 'folder'):
    { kind: 'missing' } | { kind: 'refused'; message: string } | { kind: 'real'; path: string; inside: boolean } => {
    const path = join(base, rel);
    let to: string;
    try {
      to = realpathSync.native(path);
    } catch {
      try {
        lstatSync(path);
      } catch {
        return { kind: 'missing' };
      }
      return { kind: 'refused', message: `a link to nothing (a broken symlink); put the ${noun} itself in ${what}` };
    }
    return { kind: 'real', path: to, inside: isInside(realRoot(), to) };
  };
  const file = (rel: string): ConfinedFile => {
    const r = realInside(rel, 'file');
    if (r.kind !== 'real') return r;
    if (!r.inside) {
      return { kind: 'refused', message: `a link to a file outside ${what}; packsmith reads only files inside ${what}: copy the file in instead of linking to it` };
    }
    const st = statSync(r.path);
    if (st.isDirectory()) return { kind: 'refused', message: 'a folder where a file was expected' };
    if (!st.isFile()) return { kind: 'refused', message: 'not a regular file (a device, pipe or socket); put a plain file here' };
    if (st.size > MAX_INPUT_BYTES) return { kind: 'refused', message: `${st.size} bytes: far larger than any job file (at most ${MAX_INPUT_BYTES}); is this the right file?` };
    return { kind: 'file', path: r.path };
  };
  return {
    file,
    read(rel) {
      const f = file(rel);
      if (f.kind === 'missing') return null;
      if (f.kind === 'refused') throw new Error(`${rel}: ${f.message}`);
      return readFileSync(f.path);
    },
    folder(rel) {
      const r = realInside(rel, 'folder');
      if (r.kind !== 'real') return r;
      if (!r.inside) return { kind: 'refused', message: `a link to a folder outside ${what}; packsmith reads only inside ${what}` };
      if (!statSync(r.path).isDirectory()) return { kind: 'refused', message: `a file where a folder was expected` };
      return { kind: 'folder', path: r.path };
    },
  };
}

/**
 * Where `rel` inside `root` may be read from: a regular file whose real path is inside `root`.
 * `what` names the folder in messages ("the job folder", "the theme folder").
 */
export const confinedFile = (root: string, rel: string, what: string): ConfinedFile => confinedTo(root, what).file(rel);

/** Read a confined file's bytes, or null when missing; throws a message when refused. */
export const readConfined = (root: string, rel: string, what: string): Buffer | null => confinedTo(root, what).read(rel);

/** A sub-folder of `root` that may be listed: its real path inside `root`. */
export const confinedFolder = (root: string, rel: string, what: string): ConfinedFolder => confinedTo(root, what).folder(rel);
