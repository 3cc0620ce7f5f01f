// What a build remembers of the issued revisions' files between runs: each file's SHA-256 by its
// size and modification time, kept with its revision's manifest hash (a changed manifest forgets
// them). A build then need not re-hash every revision of the archive each time; `verify` never
// uses this and re-hashes every file. Kept in the output folder (a dot-file the site ignores).
import { existsSync, readFileSync, type Stats } from 'node:fs';
import { join } from 'node:path';
import { writeReplacing } from './files.js';
import { parseJson } from './json.js';

export const KNOWN_FILE = '.revision-hashes.json';

/** revision folder → its manifest's SHA-256 and, by file name, [size, mtime in ms, SHA-256] */
type Known = Record<string, { manifest: string; files: Record<string, [number, number, string]> }>;

export interface KnownHashes {
  /** The SHA-256 of `file` in the revision folder `dir` whose manifest hashes to `manifest`: remembered where its size and time match, else `compute()`d and remembered. */
  hash(dir: string, manifest: string, file: string, st: Stats, compute: () => string): string;
  /** Write what was learnt this run (nothing when nothing was). */
  save(): void;
}

export function knownHashes(out: string): KnownHashes {
  const path = join(out, KNOWN_FILE);
  let known: Known = {};
  try {
    const parsed = existsSync(path) ? parseJson(readFileSync(path, 'utf8')) : null;
    if (parsed?.ok && parsed.value !== null && typeof parsed.value === 'object') known = parsed.value as Known;
  } catch {
    /* unreadable: start afresh */
  }
  let changed = false;
  return {
    hash(dir, manifest, file, st, compute) {
      const entry = known[dir]?.manifest === manifest ? known[dir]! : (known[dir] = { manifest, files: {} });
      const was = entry.files[file];
      if (Array.isArray(was) && was[0] === st.size && was[1] === st.mtimeMs && typeof was[2] === 'string') return was[2];
      const sha = compute();
      entry.files[file] = [st.size, st.mtimeMs, sha];
      changed = true;
      return sha;
    },
    save() {
      if (changed && existsSync(out)) writeReplacing(path, `${JSON.stringify(known)}\n`);
      changed = false;
    },
  };
}
