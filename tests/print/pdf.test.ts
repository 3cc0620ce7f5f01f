// The printer runs no script and lets no request leave the machine.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { findChromium, launchBrowser, type PrintBrowser } from '../../src/print/browser.js';
import { printPdf } from '../../src/print/pdf.js';
import { pdfText } from '../helpers/pdf.js';

const chromium = findChromium();

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
