// Chromium profile folders left by runs that were killed outright are removed by the next run
// (src/print/browser.ts clearStaleProfiles), and that clean-up never stops a print: two builds
// starting at once on one machine (the shards of a build, or the test suite's workers) may both
// remove the same folder, and a removal that fails is left for the next run.
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { clearStaleProfiles } from '../../src/print/browser.js';

/** The id of a process that has ended. */
const endedPid = (): number => spawnSync(process.execPath, ['-e', '0']).pid!;

function profile(folder: string, name: string): string {
  const dir = join(folder, name);
  mkdirSync(join(dir, 'Default'), { recursive: true });
  writeFileSync(join(dir, 'Default', 'Preferences'), '{}');
  return dir;
}

describe('clearStaleProfiles', () => {
  it('removes the folders of ended runs and keeps those of running ones and anything else', () => {
    const folder = mkdtempSync(join(tmpdir(), 'packsmith-profiles-'));
    const stale = profile(folder, `${endedPid()}-abc123`);
    const mine = profile(folder, `${process.pid}-def456`);
    const other = profile(folder, 'not-a-profile');
    expect(clearStaleProfiles(folder)).toEqual([stale.split('/').pop()]);
    expect(existsSync(stale)).toBe(false);
    expect(existsSync(mine)).toBe(true);
    expect(existsSync(other)).toBe(true);
  });

  it('goes on when a stale folder cannot be removed (it is tried again next run)', (ctx) => {
    const folder = mkdtempSync(join(tmpdir(), 'packsmith-profiles-'));
    const stuck = profile(folder, `${endedPid()}-stuck1`);
    const stale = profile(folder, `${endedPid()}-gone22`);
    const pinned = join(stuck, 'Default', 'Preferences');
    // an immutable file (ext4's i attribute) stops its folder's removal, even for root
    if (spawnSync('chattr', ['+i', pinned]).status !== 0) {
      ctx.skip(); // no chattr or no such attribute on this file system: nothing here can make a removal fail
      return;
    }
    try {
      expect(clearStaleProfiles(folder)).toEqual([stale.split('/').pop()]);
      expect(existsSync(stale)).toBe(false);
      expect(existsSync(pinned)).toBe(true);
    } finally {
      spawnSync('chattr', ['-i', pinned]);
    }
    expect(clearStaleProfiles(folder)).toEqual([stuck.split('/').pop()]);
  });
});
