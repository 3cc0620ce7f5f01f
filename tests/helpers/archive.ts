// Test jobs copied out of tests/fixtures/ (issue writes revisions.yaml into the job folder, so a
// test never issues from the fixture itself), and a look at the files of an archive.
import { chmodSync, cpSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ROOT } from './cli.js';

export const scratch = (label: string): string => mkdtempSync(join(tmpdir(), `packsmith-${label}-`));

/**
 * Copy tests/fixtures/<name> to `parent`/projects/<name> (a fresh scratch folder by default), laid
 * out as a firm keeps its jobs: its issued revisions then go to `parent`/archive/. Returns the copy.
 */
export function copyFixture(name: string, parent = scratch(name)): string {
  const dest = join(parent, 'projects', name);
  cpSync(join(ROOT, 'tests/fixtures', name), dest, { recursive: true });
  return dest;
}

/** Replace exactly one occurrence of `from` in a file of a job folder. */
export function edit(jobDir: string, file: string, from: string, to: string): void {
  const path = join(jobDir, file);
  const text = readFileSync(path, 'utf8');
  const at = text.indexOf(from);
  if (at < 0 || text.indexOf(from, at + 1) >= 0) throw new Error(`"${from}" is not in ${file} exactly once`);
  writeFileSync(path, text.slice(0, at) + to + text.slice(at + from.length));
}

export const sha = (path: string): string => createHash('sha256').update(readFileSync(path)).digest('hex');

/** file name → SHA-256 of every file in a folder. */
export function folderHashes(dir: string): Record<string, string> {
  return Object.fromEntries(readdirSync(dir).sort().map((f) => [f, sha(join(dir, f))]));
}

export const mode = (path: string): number => statSync(path).mode & 0o777;

/** Remove a scratch folder, sealed revisions included. */
export function removeTree(dir: string): void {
  const open = (p: string) => {
    if (!statSync(p).isDirectory()) return;
    chmodSync(p, 0o755);
    for (const n of readdirSync(p)) open(join(p, n));
  };
  try {
    open(dir);
  } catch {
    /* already gone */
  }
  rmSync(dir, { recursive: true, force: true });
}

/** The archive folder of a job copied by copyFixture: archive/ beside its projects/ folder. */
export const archiveOf = (jobDir: string): string => join(jobDir, '..', '..', 'archive');
