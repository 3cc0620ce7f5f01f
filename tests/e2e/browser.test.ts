// The built site in a real browser: open index.html, follow every link between the index, the
// jobs and their revisions and into the packs, see that no request leaves the machine, and compare
// page 1 of a pack with a stored screenshot.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Page } from 'puppeteer-core';
import { run, NO_ARCHIVE } from '../helpers/cli.js';
import { againstStored, difference } from '../helpers/screenshot.js';
import { defaultJobs } from '../../src/build.js';
import { findChromium, launchBrowser, type PrintBrowser } from '../../src/print/browser.js';
import { printPdf } from '../../src/print/pdf.js';

const out = mkdtempSync(join(tmpdir(), 'packsmith-site-'));
const STORED = fileURLToPath(new URL('./screenshots/pack-job-page-1.png', import.meta.url));
const STORED_PHONE = fileURLToPath(new URL('./screenshots/pack-job-phone.png', import.meta.url));
/** A phone held upright: 390 CSS px wide. */
const PHONE = { width: 390, height: 844 };
/** Page 1 as printed on A4: the sheet less its 14 mm side margins, at 96 px per inch. */
const A4_CONTENT = { width: Math.round(((210 - 28) / 25.4) * 96), height: Math.round(((297 - 34) / 25.4) * 96) };

describe('the built site in Chromium', () => {
  let browser: PrintBrowser;
  const requests: string[] = [];
  let page: Page;
  const jobs = [...defaultJobs(), 'tests/fixtures/pack-job'];

  beforeAll(async () => {
    const r = await run(['build', ...jobs, '--out', out, ...NO_ARCHIVE]);
    if (r.code !== 0) throw new Error(r.stderr);
    const chromium = findChromium();
    if (!chromium) throw new Error('no Chromium: run scripts/install-deps.sh (or set PACKSMITH_CHROME)');
    browser = await launchBrowser(chromium);
    page = await browser.browser.newPage();
    await page.setRequestInterception(true);
    page.on('request', (req) => {
      requests.push(req.url());
      if (req.url().startsWith('file:') || req.url().startsWith('data:')) void req.continue();
      else void req.abort('blockedbyclient');
    });
  });
  afterAll(async () => { await browser?.close(); });

  const linksOf = async (p: Page) => p.$$eval('a[href]', (as) => as.map((a) => ({ href: (a as HTMLAnchorElement).href, raw: a.getAttribute('href')! })));

  it('opens index.html and follows every link to the jobs, their revisions and packs, all of them there', async () => {
    const start = pathToFileURL(join(out, 'index.html')).href;
    const seen = new Set<string>();
    const queue = [start];
    const pdfs: string[] = [];
    const broken: string[] = [];
    while (queue.length) {
      const url = queue.shift()!;
      if (seen.has(url)) continue;
      seen.add(url);
      const res = await page.goto(url, { waitUntil: 'load' });
      expect(res?.ok() ?? true, url).toBe(true);
      for (const { href, raw } of await linksOf(page)) {
        const target = new URL(href);
        if (target.protocol !== 'file:') { broken.push(`${url} → ${raw} (leaves the machine)`); continue; }
        if (raw.startsWith('#')) {
          // a link inside a pack: its target must be on the page
          if (!(await page.$(`[id="${decodeURIComponent(raw.slice(1))}"]`))) broken.push(`${url} → ${raw}`);
          continue;
        }
        target.hash = '';
        const file = fileURLToPath(target);
        if (!file.startsWith(out) || !existsSync(file)) { broken.push(`${url} → ${raw}`); continue; }
        if (file.endsWith('.pdf')) pdfs.push(file);
        else if (file.endsWith('.html')) queue.push(target.href);
      }
    }
    expect(broken).toEqual([]);
    // every job built is reachable from the index, as HTML and as PDF
    for (const job of ['tannery-row-refit', 'marsh-street-surgery', 'pack-job']) {
      expect([...seen].some((u) => u.includes(`/${job}/`) && u.endsWith('pack.html')), job).toBe(true);
      expect(pdfs.some((f) => f.includes(`/${job}/`)), job).toBe(true);
    }
    for (const f of pdfs) expect(readFileSync(f).subarray(0, 5).toString()).toBe('%PDF-');
    expect(seen.size).toBeGreaterThanOrEqual(jobs.length + 1);
  });

  it('makes no request that leaves the machine', async () => {
    expect(requests.length).toBeGreaterThan(0);
    expect(requests.filter((u) => !u.startsWith('file:') && !u.startsWith('data:'))).toEqual([]);
  });

  it('draws each status with its own shape and symbol, told apart without colour', async () => {
    await page.goto(pathToFileURL(join(out, 'pack-job/draft/pack.html')).href, { waitUntil: 'load' });
    const looks = await page.$$eval('table.counts thead .status', (els) => els.map((el) => {
      const sym = el.querySelector('.sym')!;
      const st = getComputedStyle(sym);
      // everything but colour: outline style, roundness, clipping, filled or not, the symbol, the word
      const filled = st.backgroundColor !== 'rgba(0, 0, 0, 0)';
      return [st.borderTopStyle, st.borderTopLeftRadius, st.clipPath, filled ? 'filled' : 'open', sym.textContent, el.textContent!.trim()].join('|');
    }));
    expect(looks).toHaveLength(5);
    expect(new Set(looks.map((l) => l.split('|').slice(0, 5).join('|'))).size).toBe(5);
  });

  async function pageOne(packHtml: string): Promise<Buffer> {
    await page.setViewport({ width: A4_CONTENT.width, height: A4_CONTENT.height, deviceScaleFactor: 1 });
    await page.emulateMediaType('print');
    await page.goto(pathToFileURL(packHtml).href, { waitUntil: 'load' });
    // page 1 is the cover (it ends with a page break in print); a screen has no pages, so clip to it
    const cover = await (await page.$('section.cover'))!.boundingBox();
    const shot = await page.screenshot({ clip: { x: 0, y: 0, width: A4_CONTENT.width, height: Math.min(A4_CONTENT.height, Math.ceil(cover!.y + cover!.height)) }, type: 'png' });
    await page.emulateMediaType();
    return Buffer.from(shot);
  }

  it('draws page 1 of a pack as the stored screenshot, anti-aliasing aside', async () => {
    const shot = await pageOne(join(out, 'pack-job/draft/pack.html'));
    const d = againstStored(shot, STORED);
    expect(d.sameSize).toBe(true);
    expect(d.differing / d.total).toBeLessThan(0.002);
  });

  it('and notices when page 1 really changes', async () => {
    const html = join(out, 'pack-job/draft/pack.html');
    const changed = join(out, 'pack-job/draft/changed.html');
    writeFileSync(changed, readFileSync(html, 'utf8').replace('Ampersand &amp; &lt;Sons&gt; Electrical</strong>', 'Another Firm Entirely Ltd</strong>'));
    const d = difference(await pageOne(changed), readFileSync(STORED));
    expect(d.differing).toBeGreaterThan(200);
  });

  it('reads on a phone 390 px wide: nothing cut off, wide tables scroll inside their box', async () => {
    await page.setViewport({ ...PHONE, deviceScaleFactor: 1 });
    await page.goto(pathToFileURL(join(out, 'tannery-row-refit/draft/pack.html')).href, { waitUntil: 'load' });
    const layout = await page.evaluate(() => {
      const inScroll = (el: Element) => el.closest('.scroll') !== null;
      const sticking = [...document.body.querySelectorAll('*')]
        .filter((el) => !inScroll(el) && !el.closest('svg'))
        .filter((el) => el.getBoundingClientRect().right > window.innerWidth + 0.5)
        .map((el) => `${el.tagName.toLowerCase()}.${el.className}`);
      const tables = [...document.querySelectorAll('table')].map((t) => ({ cls: t.className, boxed: inScroll(t), fits: t.getBoundingClientRect().right <= window.innerWidth + 0.5 }));
      const scrolls = [...document.querySelectorAll('.scroll')].map((b) => ({ overflow: getComputedStyle(b).overflowX, wider: b.scrollWidth > b.clientWidth, right: b.getBoundingClientRect().right }));
      return { page: document.documentElement.scrollWidth, sticking, tables, scrolls };
    });
    expect(layout.page).toBeLessThanOrEqual(PHONE.width);
    expect(layout.sticking).toEqual([]);
    // every table that does not fit sits in a box that scrolls sideways, and that box fits the screen
    for (const t of layout.tables) expect(t.fits || t.boxed, t.cls).toBe(true);
    for (const b of layout.scrolls) {
      expect(b.overflow).toBe('auto');
      expect(b.right).toBeLessThanOrEqual(PHONE.width + 0.5);
    }
    expect(layout.scrolls.some((b) => b.wider)).toBe(true); // the results schedule is wider than a phone
  });

  it('draws the top of a pack on a phone as the stored screenshot, anti-aliasing aside', async () => {
    await page.setViewport({ ...PHONE, deviceScaleFactor: 1 });
    await page.goto(pathToFileURL(join(out, 'pack-job/draft/pack.html')).href, { waitUntil: 'load' });
    const shot = Buffer.from(await page.screenshot({ clip: { x: 0, y: 0, width: PHONE.width, height: 1600 }, type: 'png' }));
    const d = againstStored(shot, STORED_PHONE);
    expect(d.sameSize).toBe(true);
    expect(d.differing / d.total).toBeLessThan(0.002);
  });

  // pack.css lays out on a screen only the parts of a pack in view where scripts are off, as on the
  // printer's page (print/pdf.ts), so that page does not lay a long pack out twice; a reader's
  // browser, and the print itself, must not change
  const SCRIPTS_OFF_RULE = /@media [^{]*\(scripting: none\) \{[^{}]*\{[^{}]*\}\s*\}/;
  const laidOut = (p: Page) => p.evaluate(() => ({
    scriptsOff: matchMedia('(scripting: none)').matches,
    skippable: [...document.querySelectorAll('section.board, .circuit')].map((el) => getComputedStyle(el).contentVisibility),
  }));

  it('lays out only what is in view on a page with scripts off, as the printer opens a pack, and all of it for a reader', async () => {
    const pack = pathToFileURL(join(out, 'tannery-row-refit/draft/pack.html')).href;
    const printers = await browser.browser.newPage();
    try {
      await printers.setJavaScriptEnabled(false);
      await printers.goto(pack, { waitUntil: 'load' });
      const off = await laidOut(printers);
      expect(off.scriptsOff).toBe(true);
      expect(off.skippable.length).toBeGreaterThan(10); // its board and every circuit of the appendix
      expect(new Set(off.skippable)).toEqual(new Set(['auto']));
    } finally {
      await printers.close();
    }
    await page.setViewport({ width: 1200, height: 900, deviceScaleFactor: 1 });
    await page.goto(pack, { waitUntil: 'load' });
    const on = await laidOut(page);
    expect(on.scriptsOff).toBe(false);
    expect(new Set(on.skippable)).toEqual(new Set(['visible']));
  });

  it('prints a pack byte for byte as it would without that rule', async () => {
    const html = join(out, 'tannery-row-refit/draft/pack.html');
    const without = join(out, 'tannery-row-refit/draft/without-rule.html');
    const text = readFileSync(html, 'utf8');
    expect(text).toMatch(SCRIPTS_OFF_RULE);
    writeFileSync(without, text.replace(SCRIPTS_OFF_RULE, ''));
    // the pack's fixed dates and renumbered structure ids (print/metadata.ts): two prints of one pack are the same bytes
    const metadata = { title: 't', author: 'a', subject: 's', keywords: [], date: '2026-03-06', producer: 'p', creator: 'c', attachments: [] };
    const opts = { header: '<span></span>', footer: '<span class="pageNumber"></span>', metadata };
    const a = (await printPdf(browser.browser, html, opts)).pdf;
    const b = (await printPdf(browser.browser, without, opts)).pdf;
    expect(a.length).toBeGreaterThan(10_000);
    expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true);
  });

  it('finds jobs on the archive index as you type, sorts them by date, and never wraps a date', async () => {
    await page.setViewport({ width: 1200, height: 900, deviceScaleFactor: 1 });
    await page.goto(pathToFileURL(join(out, 'index.html')).href, { waitUntil: 'load' });
    const shown = () => page.$$eval('#jobs-body tr', (rows) => rows.filter((r) => !(r as HTMLElement).hidden).map((r) => r.querySelector('td .muted')!.textContent));
    expect(await shown()).toEqual(['heronsgate-pottery', 'marsh-street-surgery', 'pack-job', 'tannery-row-refit']);
    const row = await page.$eval('#jobs-body tr:last-child', (r) => r.textContent);
    expect(row).toContain('Amberlode Coffee Roasters Ltd'); // the client
    expect(row).toContain('Unit 7, Tannery Row, Millbrook MB2 9LD'); // the site
    expect(row).toMatch(/1 fail, 3 attention, 144 pass/); // the counts
    await page.type('#find', 'tannery');
    expect(await shown()).toEqual(['tannery-row-refit']);
    await page.click('#find', { count: 3 });
    await page.keyboard.press('Backspace');
    await page.type('#find', 'amberlode millbrook');
    expect(await shown()).toEqual(['tannery-row-refit']);
    await page.type('#find', 'x');
    expect(await shown()).toEqual([]);
    expect(await page.$eval('#none', (p) => (p as HTMLElement).hidden)).toBe(false);
    await page.click('#find', { count: 3 });
    await page.keyboard.press('Backspace');
    expect(await shown()).toHaveLength(4);
    const dates = () => page.$$eval('#jobs-body tr', (rows) => rows.map((r) => r.getAttribute('data-date')!));
    await page.click('#sort');
    const newest = await dates();
    expect(newest).toEqual([...newest].sort().reverse());
    await page.click('#sort');
    const oldest = await dates();
    expect(oldest).toEqual([...oldest].sort());
    // a date is on one line even in a narrow window
    await page.setViewport({ ...PHONE, deviceScaleFactor: 1 });
    const wraps = await page.$$eval('td.date', (cells) => cells.map((c) => [getComputedStyle(c).whiteSpace, c.getClientRects().length]));
    for (const [ws] of wraps) expect(ws).toBe('nowrap');
  });
});
