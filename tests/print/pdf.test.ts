// The printer runs no script and lets no request leave the machine.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { findChromium, launchBrowser, type PrintBrowser } from '../../src/print/browser.js';
import { printBudgetMs, printPdf, withinBudget } from '../../src/print/pdf.js';
import { pdfText } from '../helpers/pdf.js';

const chromium = findChromium();

describe('the time a print may take', () => {
  it('grows with the pack, so no pack is refused for its size, and stops only a print that hangs', async () => {
    expect(printBudgetMs(0)).toBe(120_000);
    // a 2,000-circuit pack is about 20 MB of HTML: over 40 minutes allowed
    expect(printBudgetMs(20 * 1_048_576)).toBeGreaterThan(40 * 60_000);
    expect(printBudgetMs(40 * 1_048_576)).toBeGreaterThan(printBudgetMs(20 * 1_048_576));
    await expect(withinBudget(new Promise(() => undefined), 20, 'printing pack.html')).rejects.toThrow(/printing pack.html took more than 0 s/);
    await expect(withinBudget(Promise.resolve('done'), 1000, 'printing pack.html')).resolves.toBe('done');
  });
});

describe('printing a pack', () => {
  let browser: PrintBrowser;
  beforeAll(async () => {
    if (!chromium) throw new Error('no Chromium: run scripts/install-deps.sh (or set PACKSMITH_CHROME)');
    browser = await launchBrowser(chromium);
  });
  afterAll(async () => { await browser?.close(); });

  it('runs no JavaScript and refuses every request other than the pack itself', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'packsmith-print-'));
    const html = join(dir, 'pack.html');
    writeFileSync(html, `<!doctype html><html><head><link rel="stylesheet" href="http://127.0.0.1:9/x.css"></head>
<body><p id="p">static text</p><img src="https://example.invalid/logo.png">
<script>document.getElementById('p').textContent = 'script ran';</script></body></html>`);
    const { pdf, refused } = await printPdf(browser.browser, html, { header: '<span></span>', footer: '<span>DRAFT</span>' });
    const { text } = await pdfText(pdf);
    expect(text.join(' ')).toContain('static text');
    expect(text.join(' ')).not.toContain('script ran');
    expect(refused).toEqual(expect.arrayContaining(['http://127.0.0.1:9/x.css', 'https://example.invalid/logo.png']));
  });
});

describe('a pack that tries to leave its page', () => {
  let browser: PrintBrowser;
  beforeAll(async () => {
    if (!chromium) throw new Error('no Chromium: run scripts/install-deps.sh (or set PACKSMITH_CHROME)');
    browser = await launchBrowser(chromium);
  });
  afterAll(async () => { await browser?.close(); });

  const leave = (to: string) => {
    const dir = mkdtempSync(join(tmpdir(), 'packsmith-nav-'));
    const html = join(dir, 'pack.html');
    writeFileSync(html, `<!doctype html><html><head><meta http-equiv="refresh" content="0;url=${to}"></head><body><p>the pack</p></body></html>`);
    return printPdf(browser.browser, html, { header: '<span></span>', footer: '<span></span>' });
  };
  it.each(['https://example.invalid/', 'file:///etc/hostname'])('is refused, not printed (meta refresh to %s)', async (to) => {
    await expect(leave(to)).rejects.toThrow(/tries to open|left its page/);
  });
  it('never prints another page in its place (meta refresh to a data: URL)', async () => {
    const r = await leave('data:text/html,<p>elsewhere</p>').catch((e: unknown) => e);
    if (r instanceof Error) expect(r.message).toMatch(/tries to open|left its page/);
    else {
      const { text } = await pdfText((r as { pdf: Uint8Array }).pdf);
      expect(text.join(' ')).toContain('the pack');
      expect(text.join(' ')).not.toContain('elsewhere');
    }
  });
});
