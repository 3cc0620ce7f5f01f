// SHA-256 of bytes, of a job's input files (the input hash), and of a folder of files.
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

export const sha256 = (bytes: Uint8Array | string): string => createHash('sha256').update(bytes).digest('hex');

/** path → SHA-256 of every file, sorted by path (so the order never depends on the file system). */
export function fileHashes(files: ReadonlyMap<string, Uint8Array>): Record<string, string> {
  return Object.fromEntries([...files.keys()].sort().map((p) => [p, sha256(files.get(p)!)]));
}

/** One hash over relative paths and contents: equal exactly when every file is the same. */
export function combinedHash(hashes: Record<string, string>): string {
  return sha256(Object.keys(hashes).sort().map((p) => `${p}\0${hashes[p]}\n`).join(''));
}

/** Every file under a folder, relative path (with /) → bytes. */
export function readTree(dir: string, prefix = ''): Map<string, Uint8Array> {
  const files = new Map<string, Uint8Array>();
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const rel = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isDirectory()) for (const [p, b] of readTree(join(dir, entry.name), rel)) files.set(p, b);
    else if (entry.isFile()) files.set(rel, readFileSync(join(dir, entry.name)));
  }
  return files;
}
