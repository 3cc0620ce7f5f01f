import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    // vitest's default on 2 cores is one worker (cores - 1), which runs the files one after
    // another; the end-to-end files spend much of their time waiting on Chromium, so two run at once.
    maxWorkers: 2,
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
  },
});
