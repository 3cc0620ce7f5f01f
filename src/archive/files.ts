// File writing that survives an interruption: a file is there whole or not at all, and what an
// interrupted run left behind is named after its process so a later run can tell it is stale.
import { chmodSync, closeSync, fsyncSync, openSync, readdirSync, renameSync, rmSync, statSync, writeSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { basename, dirname, join } from 'node:path';

/**
 * Create a file that must not exist yet, and flush it to disk. `seen` is given the bytes written:
 * a text is encoded once, for the file and for whatever `seen` makes of it (its hash).
 */
export function writeNew(path: string, bytes: Uint8Array | string, seen?: (bytes: Uint8Array) => void): void {
  const fd = openSync(path, 'wx', 0o644);
  try {
    const buf = typeof bytes === 'string' ? Buffer.from(bytes) : bytes;
    let done = 0;
    while (done < buf.length) done += writeSync(fd, buf, done, buf.length - done);
    fsyncSync(fd);
    seen?.(buf);
  } finally {
    closeSync(fd);
  }
}

export function fsyncDir(dir: string): void {
  const fd = openSync(dir, 'r');
  try {
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}

/** `.<what>-<pid>-<random>`: a hidden working name that says which process owns it. */
export function workingName(what: string): string {
  return `.${what}-${process.pid}-${randomBytes(4).toString('hex')}`;
}

const WORKING = /^\.([a-z.-]+)-(\d+)-[0-9a-f]{8}$/;

/** Replace a file in one step: readers see the old file or the new one, never a mix. */
export function writeReplacing(path: string, bytes: Uint8Array | string, beforeRename: () => void = () => {}): void {
  const dir = dirname(path);
  const temp = join(dir, workingName(basename(path).replace(/^\.+/, '').toLowerCase().replace(/[^a-z.-]/g, '-')));
  writeNew(temp, bytes);
  beforeRename();
  renameSync(temp, path);
  fsyncDir(dir);
}

export function pidAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Working files and folders in `dir` whose process has ended: left by an interrupted run. */
export function staleWorking(dir: string): string[] {
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return [];
  }
  return names.filter((n) => {
    const m = WORKING.exec(n);
    return m !== null && Number(m[2]) !== process.pid && !pidAlive(Number(m[2]));
  }).sort();
}

/** Remove what interrupted runs left in `dir`; returns the names removed. */
export function clearStale(dir: string): string[] {
  const stale = staleWorking(dir);
  for (const name of stale) removeWorking(join(dir, name));
  return stale;
}

export const isWorkingName = (name: string): boolean => WORKING.test(name);

/** Make a finished folder read-only: its files 0444, the folder 0555. */
export function seal(dir: string): void {
  for (const name of readdirSync(dir)) chmodSync(join(dir, name), 0o444);
  chmodSync(dir, 0o555);
  fsyncDir(dir);
}

/** Remove a working file or a (possibly sealed) working folder. */
export function removeWorking(path: string): void {
  try {
    if (statSync(path).isDirectory()) chmodSync(path, 0o755);
  } catch {
    return;
  }
  rmSync(path, { recursive: true, force: true });
}
