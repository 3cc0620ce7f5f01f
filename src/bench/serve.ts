// `npm run bench`, the preview: a job of 40 circuits served by `packsmith serve` and open in
// Chromium; a readings file is saved and the time is taken until the open page shows the new value
// and painted (watch → load, check, render → server-sent event → the page updated in place).
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
  /** of which the time from the save to the render's start (the watcher, and the wait for an editor's further writes), ms */
  watch: number[];
  /** of which the time from the render's end to the page showing the value, painted (event, fetch, update), ms */
  browser: number[];
  /** how many of the saves loaded the page again rather than updating it in place */
  reloads: number;
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
  const watch: number[] = [];
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
    await page.setViewport({ width: 1280, height: 900 });
    await page.goto(`${s.url}job/${encodeURIComponent(basename(job))}/`, { waitUntil: 'load' });
    // looking at the circuit re-tested; a mark on the window tells whether the page was loaded again
    await page.evaluate((id) => { document.getElementById(id)!.scrollIntoView(); (window as { benchMark?: number }).benchMark = 1; }, anchor);
    let reloads = 0;
    // dated today, so the session is the latest and its reading is the one the pack judges
    const file = join(job, `readings/${today()}-bench.csv`);
    for (let i = 0; i <= Math.min(saves, 24); i++) {
      const zs = `0.${51 + 2 * i}`; // 0.51, 0.53 … 0.99: no trailing zero, so each is shown as written
      current = [];
      const t0 = performance.now();
      writeFileSync(file, `board,ref,zs_ohm\n${board},${ref},${zs}\n`);
      // the circuit's own measured-Zs check, judged on the new value (another circuit may show the same value)
      await page.waitForFunction((id, text) => document.getElementById(id)?.textContent?.includes(text), { timeout: 30_000, polling: 'raf' }, anchor, `measured Zs ${zs} Ω `);
      // and the frame that shows it painted: a task queued from the next frame's callback runs after its paint
      await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => setTimeout(done, 0))));
      const t1 = performance.now();
      const ms = current.reduce((a, b) => a + b, 0);
      if (i === 0) continue; // the first save adds the file: a warm-up
      if (!(await page.evaluate(() => (window as { benchMark?: number }).benchMark === 1))) {
        reloads++;
        await page.evaluate(() => { (window as { benchMark?: number }).benchMark = 1; });
      }
      saveToPage.push(t1 - t0);
      render.push(ms);
      watch.push(renderedAt - ms - t0);
      browserMs.push(t1 - renderedAt);
    }
    return { circuits: rows(job), saveToPage, render, watch, browser: browserMs, reloads };
  } finally {
    await browser.close();
    await s.close();
    rmSync(root, { recursive: true, force: true });
  }
}
