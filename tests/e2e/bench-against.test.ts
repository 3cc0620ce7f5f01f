// The bench's side-by-side HTML stage (src/bench/against.ts, src/bench/stage-at.ts): the child that
// times one cold pass of the code at a root, the order of the rounds, and the ratio read from them.
// Checking out and building another revision takes the better part of a minute and is left to the
// bench itself (`node dist/bench/against.js REV`).
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { againstRow, checkoutBuilt, commitOf, firstInRound, speedUp } from '../../src/bench/against.js';
import { generateArchive } from '../../src/bench/generate.js';
import { PACKAGE_ROOT } from '../../src/paths.js';

const STAGE_AT = join(PACKAGE_ROOT, 'dist/bench/stage-at.js');

describe('the HTML stage side by side with another revision', () => {
  it('times one cold pass of the code at a root, over every job given', () => {
    const archive = generateArchive(join(mkdtempSync(join(tmpdir(), 'packsmith-against-')), 'projects'), 3, 5);
    const r = spawnSync(process.execPath, [STAGE_AT, PACKAGE_ROOT, archive.root], { encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const pass = JSON.parse(r.stdout) as { seconds: number; jobs: number; circuits: number };
    expect(pass.jobs).toBe(3);
    expect(pass.circuits).toBe(archive.circuits);
    expect(pass.seconds).toBeGreaterThan(0);
  });

  it('says which job the code at a root cannot read, and fails', () => {
    const r = spawnSync(process.execPath, [STAGE_AT, join(tmpdir(), 'packsmith-no-such-root'), PACKAGE_ROOT], { encoding: 'utf8' });
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^stage-at: /);
  });

  it('takes the two codes first in turn', () => {
    expect([0, 1, 2, 3, 4, 5].map(firstInRound)).toEqual([0, 1, 0, 1, 0, 1]);
  });

  it('reads the ratio round by round: their time over ours in the same round, not the ratio of the two medians', () => {
    // rounds in a quiet, a busy and a middling minute: the rounds' ratios are 3, 1 and 2.5, so the
    // median 2.5; the ratio of the two medians (4 over 2) would read 2
    const r = { ours: [1, 4, 2], theirs: [3, 4, 5] };
    expect(speedUp(r)).toEqual({ median: 2.5, min: 1, max: 3 });
    expect(speedUp({ ours: [1, 1], theirs: [2, 3] }).median).toBe(2.5); // an even count: the mean of the middle two
    expect(() => speedUp({ ours: [1, 2], theirs: [1] })).toThrow(/each round/);
    const row = againstRow('v0', { ...r, circuits: 600 });
    expect(row[1]).toBe('2.50 times as fast');
    expect(row[3]).toContain('this code 300 circuits/s, v0 150 circuits/s');
  });

  it('knows a revision by any name git knows, and refuses one it does not before checking anything out', () => {
    const head = spawnSync('git', ['rev-parse', 'HEAD'], { cwd: PACKAGE_ROOT, encoding: 'utf8' }).stdout.trim();
    expect(commitOf('HEAD')).toBe(head);
    expect(() => checkoutBuilt('no-such-revision-of-packsmith')).toThrow(/git rev-parse/);
    const worktrees = spawnSync('git', ['worktree', 'list'], { cwd: PACKAGE_ROOT, encoding: 'utf8' }).stdout;
    expect(worktrees).not.toContain('packsmith-against-');
  });
});
