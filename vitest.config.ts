import { defineConfig } from 'vitest/config';

// Files that only call the code in this process: no Chromium, no child packsmith, no server, no
// environment variables. Most of their time was spent importing the same modules again for every
// file, so they share one module graph per worker (threads, no isolation); each file still runs
// its own suite. A file that starts a browser or a process (helpers/cli.ts `run` keeps one shared
// Chromium per file and closes it after the file) stays in a fork of its own.
const IN_PROCESS = ['calc', 'reference', 'model', 'render', 'docs', 'archive', 'load'].map((d) => `tests/${d}/**/*.test.ts`);

export default defineConfig({
  test: {
    // vitest's default on 2 cores is one worker (cores - 1), which runs the files one after
    // another; the end-to-end files spend much of their time waiting on Chromium, so two run at once.
    maxWorkers: 2,
    testTimeout: 60_000,
    hookTimeout: 120_000,
    projects: [
      { extends: true, test: { name: 'in-process', include: IN_PROCESS, pool: 'threads', isolate: false } },
      { extends: true, test: { name: 'end-to-end', include: ['tests/**/*.test.ts'], exclude: IN_PROCESS, pool: 'forks' } },
    ],
  },
});
