// The glance that lets a build start Chromium early: by modification times only, a hint (whether a
// job is rebuilt is decided by its content hash, tests/e2e/incremental.test.ts).
import { describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { mayHaveChanged } from '../../src/archive/touched.js';
import { STAMP_FILE } from '../../src/archive/fingerprint.js';

/** A job folder and a draft folder whose stamp was written at `stampAt` (s), every input at `inputsAt`. */
function job(stampAt: number, inputsAt: number) {
  const root = mkdtempSync(join(tmpdir(), 'packsmith-touched-'));
  const dir = join(root, 'job');
  const draft = join(root, 'out', 'job', 'draft');
  mkdirSync(join(dir, 'readings'), { recursive: true });
  mkdirSync(draft, { recursive: true });
  for (const f of ['project.yaml', 'circuits.csv', 'readings/2026-01-16.csv']) writeFileSync(join(dir, f), 'x');
  for (const p of [join(dir, 'project.yaml'), join(dir, 'circuits.csv'), join(dir, 'readings/2026-01-16.csv'), join(dir, 'readings'), dir]) utimesSync(p, inputsAt, inputsAt);
  writeFileSync(join(draft, STAMP_FILE), '{}');
  utimesSync(join(draft, STAMP_FILE), stampAt, stampAt);
  return { root, dir, draft };
}

describe('the glance at whether a draft may be out of date', () => {
  it('says no when every input is older than the stamp', () => {
    const j = job(2_000_000, 1_000_000);
    expect(mayHaveChanged(j.dir, j.draft)).toBe(false);
    rmSync(j.root, { recursive: true, force: true });
  });

  it('says yes when a reading was saved after the stamp, or there is no stamp', () => {
    const j = job(2_000_000, 1_000_000);
    utimesSync(join(j.dir, 'readings/2026-01-16.csv'), 3_000_000, 3_000_000);
    expect(mayHaveChanged(j.dir, j.draft)).toBe(true);
    expect(mayHaveChanged(j.dir, join(j.root, 'out', 'other', 'draft'))).toBe(true);
    rmSync(j.root, { recursive: true, force: true });
  });

  it('says yes when a file was added to the job folder after the stamp', () => {
    const j = job(2_000_000, 1_000_000);
    writeFileSync(join(j.dir, 'notes.md'), 'new'); // now: later than the stamp
    expect(mayHaveChanged(j.dir, j.draft)).toBe(true);
    rmSync(j.root, { recursive: true, force: true });
  });
});
