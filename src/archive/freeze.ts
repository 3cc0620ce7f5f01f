// Writing a revision: its files go into a hidden working folder beside the rev-N folders, are
// flushed to disk and made read-only, and the folder is then renamed to rev-N in one step. An
// interrupted run leaves only the hidden folder (removed by the next run). rename(2) never
// replaces a folder that holds files, so an issued revision is never overwritten and two runs
// cannot both take one number: the later one is told the number is taken.
import { mkdirSync, renameSync } from 'node:fs';
import { join } from 'node:path';
import { fsyncDir, removeWorking, seal, workingName, writeNew } from './files.js';
import { revisionDirName } from './revisions.js';

export interface Staging {
  dir: string;
  /** writes the file and gives its path; `seen` is given every byte written, in order */
  add(name: string, bytes: Uint8Array | string, seen?: (bytes: Uint8Array) => void): string;
  seal(): void;
  /** rename to rev-N; "taken" when another run got there first (the working folder is then removed) */
  commit(n: number): 'committed' | 'taken';
  discard(): void;
}

export function openStaging(jobOut: string): Staging {
  mkdirSync(jobOut, { recursive: true });
  const dir = join(jobOut, workingName('incoming'));
  mkdirSync(dir);
  return {
    dir,
    add(name, bytes, seen) {
      const path = join(dir, name);
      writeNew(path, bytes, seen);
      return path;
    },
    seal: () => seal(dir),
    commit(n) {
      try {
        renameSync(dir, join(jobOut, revisionDirName(n)));
      } catch (e) {
        const code = (e as NodeJS.ErrnoException).code;
        if (code === 'ENOTEMPTY' || code === 'EEXIST' || code === 'ENOTDIR') {
          removeWorking(dir);
          return 'taken';
        }
        throw e;
      }
      fsyncDir(jobOut);
      return 'committed';
    },
    discard: () => removeWorking(dir),
  };
}
