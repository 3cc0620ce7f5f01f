// HTML file → PDF. JavaScript is off and every request other than the pack file itself (and
// data: URLs inside it) is refused, so a pack cannot reach the network or run code.
import { pathToFileURL } from 'node:url';
import type { Browser } from 'puppeteer-core';

export interface PdfOptions {
  /** running footer: job title, the revision word (DRAFT on drafts), page X of Y */
  footerLeft: string;
  footerMiddle: string;
  format?: 'A4' | 'Letter';
}

const escapeHtml = (s: string): string =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function footerTemplate(opts: PdfOptions): string {
  return `<div style="font-family:'DejaVu Sans',sans-serif;font-size:7.5pt;color:#444;width:100%;margin:0 14mm;display:flex;justify-content:space-between">
<span>${escapeHtml(opts.footerLeft)}</span><span style="font-weight:bold">${escapeHtml(opts.footerMiddle)}</span>
<span>page <span class="pageNumber"></span> of <span class="totalPages"></span></span></div>`;
}

/** Print one HTML file; returns the PDF bytes and the requests that were refused. */
export async function printPdf(browser: Browser, htmlPath: string, opts: PdfOptions): Promise<{ pdf: Uint8Array; refused: string[] }> {
  const page = await browser.newPage();
  const refused: string[] = [];
  try {
    await page.setJavaScriptEnabled(false);
    await page.setRequestInterception(true);
    const own = pathToFileURL(htmlPath).href;
    page.on('request', (req) => {
      const url = req.url();
      if (url === own || url.startsWith('data:')) void req.continue();
      else {
        refused.push(url);
        void req.abort('blockedbyclient');
      }
    });
    await page.goto(own, { waitUntil: 'load' });
    const pdf = await page.pdf({
      format: opts.format ?? 'A4',
      printBackground: true,
      displayHeaderFooter: true,
      headerTemplate: '<span></span>',
      footerTemplate: footerTemplate(opts),
      preferCSSPageSize: false,
      margin: { top: '16mm', bottom: '18mm', left: '14mm', right: '14mm' },
    });
    return { pdf, refused };
  } finally {
    await page.close();
  }
}
