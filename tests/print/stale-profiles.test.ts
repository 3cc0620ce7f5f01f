// Chromium profile folders left by runs that were killed outright are removed by the next run
// (src/print/browser.ts clearStaleProfiles), and that clean-up never stops a print: two builds
// starting at once on one machine (the shards of a build, or the test suite's workers) may both
// remove the same folder, and a removal that fails is left for the next run.
import { describe, expect, it } from 'vitest';
import { spawn, spawnSync } from 'node:child_process';
import { hostname } from 'node:os';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
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

  it('removes a folder whose Chromium has ended but was never reaped (a zombie, as in a container whose first process does not reap)', async (ctx) => {
    // sh starts `sleep 0` and becomes `sleep 5`, which never waits for it: the ended `sleep 0` stays a zombie
    const parent = spawn('sh', ['-c', 'sleep 0 & echo $!; exec sleep 5'], { stdio: ['ignore', 'pipe', 'ignore'] });
    try {
      const zombie = Number(await new Promise<string>((resolve) => parent.stdout.once('data', (d: Buffer) => resolve(d.toString()))));
      let state = '';
      for (let i = 0; i < 50 && state !== 'Z'; i++) {
        await new Promise((r) => setTimeout(r, 20));
        try {
          const stat = readFileSync(`/proc/${zombie}/stat`, 'latin1');
          state = stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3);
        } catch {
          break; // no /proc: not Linux
        }
      }
      if (state !== 'Z') {
        ctx.skip(); // no zombie to be seen here
        return;
      }
      const folder = mkdtempSync(join(tmpdir(), 'packsmith-profiles-'));
      const stale = profile(folder, `${endedPid()}-zombie`);
      symlinkSync(`${hostname()}-${zombie}`, join(stale, 'SingletonLock')); // as Chromium names itself in its lock
      expect(clearStaleProfiles(folder)).toEqual([stale.split('/').pop()]);
      expect(existsSync(stale)).toBe(false);
    } finally {
      parent.kill('SIGKILL');
    }
  });

  it('keeps a folder whose Chromium still runs, though the packsmith that started it has ended', () => {
    const folder = mkdtempSync(join(tmpdir(), 'packsmith-profiles-'));
    const kept = profile(folder, `${endedPid()}-live01`);
    symlinkSync(`${hostname()}-${process.pid}`, join(kept, 'SingletonLock')); // this test's process stands for the running Chromium
    expect(clearStaleProfiles(folder)).toEqual([]);
    expect(existsSync(kept)).toBe(true);
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
