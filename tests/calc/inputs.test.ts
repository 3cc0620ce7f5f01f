import { describe, expect, it } from 'vitest';
import { loadJob } from '../../src/job.js';
import { formatError } from '../../src/load/raw.js';

describe('inputs outside the published tables', () => {
  const job = loadJob('tests/fixtures/out-of-table');
  const lines = job.ok ? [] : job.errors.map(formatError);
  it('are input errors located in circuits.csv, one per circuit, never guessed', () => {
    expect(job.ok).toBe(false);
    expect(lines).toEqual([
      expect.stringMatching(/^circuits\.csv:2:8: live_mm2: found 0.75 mm²; the capacity tables held cover 1, 1\.5, /),
      expect.stringMatching(/^circuits\.csv:3:11: method: no capacity table for method F/),
      expect.stringMatching(/^circuits\.csv:4:12: conductor: .*copper only/),
      expect.stringMatching(/^circuits\.csv:5:13: grouped: found 30 circuits; .*up to 20/),
    ]);
  });
});
