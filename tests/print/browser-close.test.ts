// Closing the print browser: Chromium and every process it started end, and nothing of it is
// left in the temporary folder (its profile, and the folder its SingletonSocket links into).
import { describe, expect, it } from 'vitest';
import { existsSync, readlinkSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { findChromium, launchBrowser } from '../../src/print/browser.js';

const chromium = findChromium();

/** Whether any process of the process group `pgid` still runs. */
function groupAlive(pgid: number): boolean {
  try {
    process.kill(-pgid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

describe('closing the print browser', () => {
  it('ends Chromium with all its processes and removes its profile and socket folder', async () => {
    if (!chromium) throw new Error('no Chromium: run scripts/install-deps.sh (or set PACKSMITH_CHROME)');
    const b = await launchBrowser(chromium);
    const page = await b.browser.newPage();
    await page.goto('data:text/html,<p>a renderer to end too</p>');
    const pid = b.browser.process()!.pid!;
    const profile = (b.browser.process()!.spawnargs.find((a) => a.startsWith('--user-data-dir=')) ?? '').slice('--user-data-dir='.length);
    expect(existsSync(profile)).toBe(true);
    const socketDir = dirname(readlinkSync(join(profile, 'SingletonSocket')));
    expect(existsSync(socketDir)).toBe(true);
    await b.close();
    expect(existsSync(profile)).toBe(false);
    expect(existsSync(socketDir)).toBe(false);
    // killed processes leave the table once reaped: give the kernel a moment on a loaded machine
    for (let i = 0; i < 50 && groupAlive(pid); i++) await new Promise((r) => setTimeout(r, 100));
    expect(groupAlive(pid)).toBe(false);
  });
});
