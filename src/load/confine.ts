// Confined reading: packsmith reads only inside the folders it was given (the job folder, the
// firm's folder, the theme folder), never through a symlink that leaves them, only regular files
// (a FIFO or a device would hang or flood the read), and only files of a sane size.
//
// A folder's real path is looked up once (`confinedTo`), and each sub-folder's; then a file that
// is not a link costs one lstat and its read, a link one realpath (the system's, not node's walk
// of every path component) and one stat.
import { lstatSync, readFileSync, realpathSync, statSync, type Stats } from 'node:fs';
import { basename, dirname, isAbsolute, join, normalize, relative, resolve, sep } from 'node:path';

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

/** A path's own lstat (a link not followed), or null where there is nothing to see. */
function lstatOrNull(path: string): Stats | null {
  try {
    return lstatSync(path);
  } catch {
    return null;
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
  /** The real path of each sub-folder files were read from (null: none there), looked up once. */
  const realDirs = new Map<string, string | null>();
  const realDir = (rel: string): string | null => {
    let r = realDirs.get(rel);
    if (r === undefined) {
      try {
        r = realpathSync.native(join(base, rel));
      } catch {
        r = null;
      }
      realDirs.set(rel, r);
    }
    return r;
  };
  type Real = { kind: 'missing' } | { kind: 'refused'; message: string } | { kind: 'real'; path: string; inside: boolean; stat: Stats | null };
  /** The real path of `path` (links followed), or why there is none: missing, or a link to nothing. */
  const follow = (path: string, noun: 'file' | 'folder', stat: Stats | null): Real => {
    let to: string;
    try {
      to = realpathSync.native(path);
    } catch {
      if (stat === null && lstatOrNull(path) === null) return { kind: 'missing' };
      return { kind: 'refused', message: `a link to nothing (a broken symlink); put the ${noun} itself in ${what}` };
    }
    return { kind: 'real', path: to, inside: isInside(realRoot(), to), stat: null };
  };
  /**
   * The real path of `rel` (links followed), and whether it stays inside the folder. The folder
   * holding it is made real once; the name itself, when not a link, is then real as it stands
   * (its lstat is its stat); a link is followed by one realpath.
   */
  const realInside = (rel: string, noun: 'file' | 'folder'): Real => {
    const norm = normalize(rel);
    const dir = dirname(norm);
    if (isAbsolute(norm) || norm === '..' || norm.startsWith(`..${sep}`)) return follow(join(base, rel), noun, null);
    const holder = dir === '.' ? realRoot() : realDir(dir);
    if (holder === null) return follow(join(base, rel), noun, null); // its folder is missing, or a link to nothing
    const path = join(holder, basename(norm));
    const st = lstatOrNull(path);
    if (st === null) return { kind: 'missing' };
    if (st.isSymbolicLink()) return follow(path, noun, st);
    return { kind: 'real', path, inside: isInside(realRoot(), path), stat: st };
  };
  const file = (rel: string): ConfinedFile => {
    const r = realInside(rel, 'file');
    if (r.kind !== 'real') return r;
    if (!r.inside) {
      return { kind: 'refused', message: `a link to a file outside ${what}; packsmith reads only files inside ${what}: copy the file in instead of linking to it` };
    }
    const st = r.stat ?? statSync(r.path);
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
      if (!(r.stat ?? statSync(r.path)).isDirectory()) return { kind: 'refused', message: `a file where a folder was expected` };
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
