// One headless Chromium for a whole build, started with puppeteer-core from the system's
// Chromium (PACKSMITH_CHROME, else the usual Debian paths). Never downloads a browser.
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readlinkSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import puppeteer, { type Browser } from 'puppeteer-core';

const CANDIDATES = ['/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome-stable', '/usr/bin/google-chrome'];

export const CHROMIUM_FLAGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
  '--disable-extensions',
  '--disable-default-apps',
  '--font-render-hinting=none',
];

export function findChromium(env: NodeJS.ProcessEnv = process.env): string | null {
  const wanted = env.PACKSMITH_CHROME;
  if (wanted) return existsSync(wanted) ? wanted : null;
  return CANDIDATES.find((p) => existsSync(p)) ?? null;
}

export const NO_CHROMIUM_HELP =
  'No Chromium found, so no PDF was printed (the HTML packs are written). Install it with ' +
  '"apt-get install -y chromium" (Debian/Ubuntu), or point PACKSMITH_CHROME at a Chromium or Chrome binary, then build again.';

export interface PrintBrowser {
  browser: Browser;
  close(): Promise<void>;
}

/** Chromium's profile folders, one per running packsmith, all in one folder of the temporary folder. */
export const profilesFolder = (): string => join(tmpdir(), `packsmith-chromium-${process.getuid?.() ?? 'user'}`);

const alive = (pid: number): boolean => {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
};

/**
 * Remove the profile folders of runs that ended without removing theirs (killed outright): a
 * folder is named after its packsmith's process id, and is kept while that process or the
 * Chromium holding the profile (its SingletonLock names it) still runs.
 */
export function clearStaleProfiles(folder = profilesFolder()): string[] {
  let names: string[];
  try {
    names = readdirSync(folder);
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const name of names) {
    const m = /^(\d+)-[0-9A-Za-z]+$/.exec(name);
    if (!m || Number(m[1]) === process.pid || alive(Number(m[1]))) continue;
    let chromium = 0;
    try {
      chromium = Number(/-(\d+)$/.exec(readlinkSync(join(folder, name, 'SingletonLock')))?.[1] ?? 0);
    } catch {
      /* no lock: Chromium is not running on it */
    }
    if (chromium > 0 && alive(chromium)) continue;
    rmSync(join(folder, name), { recursive: true, force: true });
    removed.push(name);
  }
  return removed;
}

/** How long Chromium may take to start. */
export const LAUNCH_TIMEOUT_MS = 120_000;

export async function launchBrowser(executablePath: string): Promise<PrintBrowser> {
  const folder = profilesFolder();
  clearStaleProfiles(folder);
  mkdirSync(folder, { recursive: true, mode: 0o700 });
  const profile = mkdtempSync(join(folder, `${process.pid}-`));
  let browser: Browser;
  try {
    browser = await puppeteer.launch({
      executablePath,
      headless: true,
      // Over a pipe, Chromium ends with packsmith even when packsmith is killed outright.
      pipe: true,
      // Starting does not grow with the packs; a loaded machine can still take its time.
      timeout: LAUNCH_TIMEOUT_MS,
      // No limit per browser command: printing a large pack is one command that takes as long as
      // the pack is long. Each print has a watchdog scaled to its pack instead (pdf.ts).
      protocolTimeout: 0,
      args: [...CHROMIUM_FLAGS, `--user-data-dir=${profile}`],
    });
  } catch (e) {
    rmSync(profile, { recursive: true, force: true });
    throw e;
  }

  return {
    browser,
    async close() {
      try {
        await browser.close();
      } finally {
        rmSync(profile, { recursive: true, force: true });
      }
    },
  };
}
