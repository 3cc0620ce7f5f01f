// Which command lines run without V8's optimising compiler (src/commands/tuning.ts): a `check` of a
// job whose circuits.csv is small, and nothing else. That the results are the same either way is
// tests/e2e/bundle.test.ts's comparison: the bundled command line (tuned) against the compiled
// modules run without the tuning, byte for byte, on the demo jobs and a generated 40-circuit job.
import { describe, expect, it } from 'vitest';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { checkedFolder, quickCheck, QUICK_CHECK_BYTES } from '../../src/commands/tuning.js';
import { generateArchive } from '../../src/bench/generate.js';

const root = mkdtempSync(join(tmpdir(), 'packsmith-tuning-'));
const small = generateArchive(join(root, 'small'), 1, 3, { circuits: [40, 40] }).jobs[0]!;
const large = generateArchive(join(root, 'large'), 1, 3, { circuits: [1000, 1000], boards: [4, 4] }).jobs[0]!;

describe('the command-line tuning', () => {
  it('finds the job folder of a check, wherever its options stand', () => {
    expect(checkedFolder(['check', 'projects/a'])).toBe('projects/a');
    expect(checkedFolder(['check', '--json', 'projects/a', '--explain'])).toBe('projects/a');
    expect(checkedFolder(['check', '--json'])).toBeNull();
    expect(checkedFolder(['build', 'projects/a'])).toBeNull();
    expect(checkedFolder([])).toBeNull();
  });

  it('tunes a check of a 40-circuit job, not one of 1,000 circuits (there the optimising compiler pays)', () => {
    expect(quickCheck(['check', small])).toBe(true);
    expect(quickCheck(['check', '--json', small])).toBe(true);
    expect(quickCheck(['check', large])).toBe(false);
    expect(QUICK_CHECK_BYTES).toBeLessThan(65_000); // a 1,000-circuit circuits.csv is about 65 kB
  });

  it('leaves every other command line and a missing job as they are', () => {
    expect(quickCheck(['build', small])).toBe(false);
    expect(quickCheck(['issue', small, '--by', 'A. Tester'])).toBe(false);
    expect(quickCheck(['check', join(root, 'no-such-job')])).toBe(false);
    expect(quickCheck(['check', join(small, 'circuits.csv')])).toBe(false); // a file, not a folder
  });
});
