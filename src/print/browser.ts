// One headless Chromium for a whole build, started with puppeteer-core from the system's
// Chromium (PACKSMITH_CHROME, else the usual Debian paths). Never downloads a browser.
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import puppeteer, { type Browser, type Page } from 'puppeteer-core';

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
  // No processes that print nothing: a spare renderer kept warm for the next tab, and the
  // address bar's pop-ups, which headless Chromium builds though it shows no window (each a
  // renderer of about 100 MB resident).
  '--disable-features=SpareRendererForSitePerProcess,WebUIOmniboxPopup,WebUIOmniboxAimPopup,WebUIOmniboxFullPopup',
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
  /**
   * A page to print on: the first time, the tab Chromium opened at start (closing it and opening
   * another cost a renderer's start, some 0.2 s before the first print); then a new one each time.
   */
  newPage(): Promise<Page>;
  close(): Promise<void>;
}

/** Chromium's profile folders, one per running packsmith, all in one folder of the temporary folder. */
export const profilesFolder = (): string => join(tmpdir(), `packsmith-chromium-${process.getuid?.() ?? 'user'}`);

/** Whether a process runs: it exists and has not ended (an ended process not yet reaped is not running). */
const alive = (pid: number): boolean => {
  try {
    process.kill(pid, 0);
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
  return !ended(pid);
};

/**
 * Whether a process has ended and waits only to be reaped (Linux: state Z in /proc/PID/stat); false
 * where that cannot be told. The Chromium of a packsmith killed outright is handed to the system's
 * first process, which in a container often never reaps it: it would otherwise count as running,
 * and its profile would be kept for good.
 */
function ended(pid: number): boolean {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'latin1');
    return stat.slice(stat.lastIndexOf(')') + 2).startsWith('Z');
  } catch {
    return false;
  }
}

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
    try {
      const socketDir = singletonDir(join(folder, name));
      if (socketDir) rmSync(socketDir, { recursive: true, force: true });
      // a Chromium's last processes may still be writing as they end: tried again briefly
      rmSync(join(folder, name), { recursive: true, force: true, maxRetries: 5, retryDelay: 50 });
    } catch {
      // another packsmith starting at the same moment removing it too (its files vanish under
      // this removal), or a file that will not go: a clean-up never stops a print; the next run tries again
      continue;
    }
    removed.push(name);
  }
  return removed;
}

/** How long Chromium may take to start. */
export const LAUNCH_TIMEOUT_MS = 120_000;

/**
 * Chromium's own folder in the temporary folder, which its profile's SingletonSocket links into
 * and which it leaves behind even when closed properly; null where there is none.
 */
function singletonDir(profile: string): string | null {
  try {
    const dir = dirname(readlinkSync(join(profile, 'SingletonSocket')));
    return /[/\\]org\.chromium\.Chromium\.\w+$/.test(dir) ? dir : null;
  } catch {
    return null;
  }
}

/**
 * End Chromium and every process it started, at once: its process group is killed and its exit
 * awaited. Nothing it holds is kept (its profile is removed next), so its own orderly shutdown,
 * a second or more on a loaded machine, buys nothing; a browser without a process of its own
 * (connected, not launched) is closed the usual way.
 */
async function stop(browser: Browser): Promise<void> {
  const proc = browser.process();
  if (!proc?.pid || proc.exitCode !== null || proc.signalCode !== null) return browser.close();
  const exited = new Promise<void>((resolve) => proc.once('exit', () => resolve()));
  try {
    process.kill(-proc.pid, 'SIGKILL'); // puppeteer starts Chromium as the leader of its own group
  } catch {
    proc.kill('SIGKILL');
  }
  await exited;
  await browser.close().catch(() => undefined); // the connection's own clean-up; the process is gone
}

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
  // the tab Chromium opens at start is kept for the first page asked for; any other it opened goes
  const [first, ...others] = await browser.pages().catch(() => []);
  await Promise.all(others.map((p) => p.close().catch(() => undefined)));
  let spare: Page | null = first ?? null;

  return {
    browser,
    async newPage() {
      const page = spare;
      spare = null;
      return page !== null && !page.isClosed() ? page : browser.newPage();
    },
    async close() {
      const socketDir = singletonDir(profile);
      try {
        await stop(browser);
      } finally {
        rmSync(profile, { recursive: true, force: true });
        if (socketDir) rmSync(socketDir, { recursive: true, force: true });
      }
    },
  };
}
