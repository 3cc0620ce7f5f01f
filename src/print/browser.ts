// One headless Chromium for a whole build, started with puppeteer-core from the system's
// Chromium (PACKSMITH_CHROME, else the usual Debian paths). Never downloads a browser.
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
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

export async function launchBrowser(executablePath: string): Promise<PrintBrowser> {
  const profile = mkdtempSync(join(tmpdir(), 'packsmith-chromium-'));
  const browser = await puppeteer.launch({
    executablePath,
    headless: true,
    // Over a pipe, Chromium ends with packsmith even when packsmith is killed outright.
    pipe: true,
    args: [...CHROMIUM_FLAGS, `--user-data-dir=${profile}`],
  });
  return {
    browser,
    async close() {
      await browser.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
