// `npm run bench`, the preview: a job of 40 circuits served by `packsmith serve` and open in
// Chromium; a readings file is saved and the time is taken until the open page shows the new value
// (watch → load, check, render → server-sent event → page updated).
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { serve } from '../serve/server.js';
import { launchBrowser } from '../print/browser.js';
import { today } from '../commands/today.js';
import { circuitAnchor } from '../render/sections/schedules.js';

export interface PreviewTimes {
  circuits: number;
  /** save → page shows the new value, ms, one per save */
  saveToPage: number[];
  /** of which the server's load, check and render, ms */
  render: number[];
  /** of which the time from the render's end to the page showing the value (event, fetch, update), ms */
  browser: number[];
}

const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
export const describeTimes = (xs: number[]): string => `median ${median(xs).toFixed(0)} ms, max ${Math.max(...xs).toFixed(0)} ms`;

/** Serve the job with the most circuits among `jobs` and time `saves` saves of one reading. */
export async function previewRefresh(jobs: string[], chromium: string, saves = 9): Promise<PreviewTimes> {
  const rows = (dir: string) => readFileSync(join(dir, 'circuits.csv'), 'utf8').trim().split('\n').length - 1;
  const biggest = jobs.reduce((a, b) => (rows(b) > rows(a) ? b : a));
  const root = mkdtempSync(join(tmpdir(), 'packsmith-bench-serve-'));
  const job = join(root, basename(biggest));
  cpSync(biggest, job, { recursive: true });
  const [board, ref] = readFileSync(join(job, 'circuits.csv'), 'utf8').split('\n')[1]!.split(',');
  const anchor = circuitAnchor({ board: board!, ref: ref! }); // the circuit's checks in the appendix
  let current: number[] = [];
  let renderedAt = 0;
  const render: number[] = [];
  const browserMs: number[] = [];
  const s = await serve({
    folder: root, out: join(root, 'out'), host: '127.0.0.1', port: 0, log: () => {},
    onRender: (_j, _v, ms) => { current.push(ms); renderedAt = performance.now(); },
  });
  const browser = await launchBrowser(chromium);
  const saveToPage: number[] = [];
  try {
    const page = await browser.browser.newPage();
    await page.setBypassCSP(true); // the waiting below is evaluated in the page, which the served policy would refuse
    await page.goto(`${s.url}job/${encodeURIComponent(basename(job))}/`, { waitUntil: 'load' });
    // dated today, so the session is the latest and its reading is the one the pack judges
    const file = join(job, `readings/${today()}-bench.csv`);
    for (let i = 0; i <= saves; i++) {
      const zs = `0.${51 + 2 * i}`; // 0.51, 0.53 … 0.69: no trailing zero, so each is shown as written
      current = [];
      const t0 = performance.now();
      writeFileSync(file, `board,ref,zs_ohm\n${board},${ref},${zs}\n`);
      // the circuit's own measured-Zs check, judged on the new value (another circuit may show the same value)
      await page.waitForFunction((id, text) => document.getElementById(id)?.textContent?.includes(text), { timeout: 30_000 }, anchor, `measured Zs ${zs} Ω `);
      const t1 = performance.now();
      if (i === 0) continue; // the first save adds the file: a warm-up
      saveToPage.push(t1 - t0);
      render.push(current.reduce((a, b) => a + b, 0));
      browserMs.push(t1 - renderedAt);
    }
    return { circuits: rows(job), saveToPage, render, browser: browserMs };
  } finally {
    await browser.close();
    await s.close();
    rmSync(root, { recursive: true, force: true });
  }
}
