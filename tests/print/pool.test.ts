// The print pool: one Chromium, a fixed number of pages reused from pack to pack.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Target } from 'puppeteer-core';
import { findChromium, launchBrowser, type PrintBrowser } from '../../src/print/browser.js';
import { createPrintPool, defaultPoolSize } from '../../src/print/pool.js';
import { pdfText } from '../helpers/pdf.js';

const chromium = findChromium();
const OPTS = { header: '<span></span>', footer: '<span style="font-size:8px">p<span class="pageNumber"></span></span>' };

describe('the print pool', () => {
  let browser: PrintBrowser;
  const dir = mkdtempSync(join(tmpdir(), 'packsmith-pool-'));
  const files = Array.from({ length: 5 }, (_, i) => {
    const f = join(dir, `pack-${i}.html`);
    writeFileSync(f, `<!doctype html><html><body><p>pack number ${i}</p>${i === 2 ? '<img src="https://example.invalid/x.png">' : ''}</body></html>`);
    return f;
  });
  beforeAll(async () => {
    if (!chromium) throw new Error('no Chromium: run scripts/install-deps.sh (or set PACKSMITH_CHROME)');
    browser = await launchBrowser(chromium);
  });
  afterAll(async () => { await browser?.close(); });

  it('is as wide as the machine has cores by default', () => {
    expect(defaultPoolSize()).toBe(availableParallelism());
  });

  it('prints many files on no more pages than its size, each PDF its own file, refusals kept apart', async () => {
    const pool = createPrintPool(browser.browser, 2);
    const pagesBefore = (await browser.browser.pages()).length;
    const results = await Promise.all(files.map((f) => pool.print(f, OPTS)));
    for (const [i, r] of results.entries()) {
      const { text } = await pdfText(r.pdf);
      expect(text.join(' ')).toContain(`pack number ${i}`);
      expect(r.refused).toEqual(i === 2 ? ['https://example.invalid/x.png'] : []);
    }
    expect(pool.stats()).toEqual({ opened: 2, busiest: 2, printed: 5 });
    expect((await browser.browser.pages()).length).toBe(pagesBefore + 2);
    await pool.close();
    expect((await browser.browser.pages()).length).toBe(pagesBefore);
  });

  it('prints first on the tab Chromium opened at start, given the launched browser, and then opens new ones', async () => {
    const own = await launchBrowser(chromium!);
    try {
      const [atStart, ...more] = await own.browser.pages();
      expect(atStart).toBeDefined();
      expect(more).toEqual([]);
      const pool = createPrintPool(own, 2);
      await pool.print(files[0]!, OPTS);
      // one pack: printed on the tab that was there, no page opened
      expect(await own.browser.pages()).toEqual([atStart]);
      await Promise.all(files.slice(0, 4).map((f) => pool.print(f, OPTS)));
      const open = await own.browser.pages();
      expect(open).toHaveLength(2);
      expect(open).toContain(atStart);
      await pool.close();
      expect(await own.browser.pages()).toEqual([]);
    } finally {
      await own.close();
    }
  });

  it('replaces a page whose print failed, and goes on printing', async () => {
    const pool = createPrintPool(browser.browser, 1);
    await expect(pool.print(join(dir, 'missing.html'), OPTS)).rejects.toThrow(/ERR_FILE_NOT_FOUND/);
    const r = await pool.print(files[0]!, OPTS);
    expect((await pdfText(r.pdf)).text.join(' ')).toContain('pack number 0');
    expect(pool.stats()).toMatchObject({ opened: 1, printed: 1 });
    await pool.close();
  });

  it('lets a producer wait for room instead of queueing everything', async () => {
    const pool = createPrintPool(browser.browser, 1);
    const first = pool.print(files[0]!, OPTS);
    // room for two: one is queued, so at once; room for one: only when that print is done
    expect(await pool.room(2).then(() => pool.stats().printed)).toBe(0);
    expect(await pool.room(1).then(() => pool.stats().printed)).toBe(1);
    await first;
    await pool.close();
  });

  it('opens a page ahead of the first print when warmed, and that print uses it', async () => {
    const pool = createPrintPool(browser.browser, 2);
    const pagesBefore = (await browser.browser.pages()).length;
    pool.warm();
    pool.warm(); // a second call opens no second page, nor does the print that comes while it opens
    const r = await pool.print(files[1]!, OPTS);
    expect((await pdfText(r.pdf)).text.join(' ')).toContain('pack number 1');
    expect(pool.stats()).toEqual({ opened: 1, busiest: 1, printed: 1 });
    expect((await browser.browser.pages()).length).toBe(pagesBefore + 1);
    await pool.close();
    expect((await browser.browser.pages()).length).toBe(pagesBefore);
  });

  it('warmed and closed before its page is open, leaves no page behind', async () => {
    const pool = createPrintPool(browser.browser, 1);
    const pagesBefore = (await browser.browser.pages()).length;
    const created = new Promise<Target>((resolve) => browser.browser.once('targetcreated', resolve));
    const destroyed = new Set<Target>();
    const onDestroyed = (t: Target) => destroyed.add(t);
    browser.browser.on('targetdestroyed', onDestroyed);
    pool.warm();
    await pool.close();
    // the page opening meanwhile closes itself when it arrives: wait for exactly that, however long it takes
    const page = await created;
    while (!destroyed.has(page)) await new Promise((r) => setTimeout(r, 20));
    browser.browser.off('targetdestroyed', onDestroyed);
    expect((await browser.browser.pages()).length).toBe(pagesBefore);
  });

  it('refuses a size below one', () => {
    expect(() => createPrintPool(browser.browser, 0)).toThrow(/at least one page/);
  });
});
