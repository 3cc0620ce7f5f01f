// HTML file → PDF. JavaScript is off and every request other than the pack file itself (and
// data: URLs inside it) is refused, so a pack cannot reach the network or run code. A pack that
// tries to navigate away (a meta refresh, even to a data: URL) is refused and not printed.
// The PDF is tagged (headings, tables, lists keep their structure for assistive technology) and
// carries an outline built from the pack's headings: one bookmark per section, board and circuit.
import { statSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import type { Browser, Page, PDFOptions } from 'puppeteer-core';
import { PART_BYTES, printInParts, SINGLE_PRINT_BYTES, type PrintFile } from './in-parts.js';
import { setPdfMetadata, type PdfMetadata } from './metadata.js';

export type PaperFormat = 'A4' | 'Letter';

export interface PdfOptions {
  /** Chromium header and footer templates (HTML; `pageNumber` and `totalPages` spans are filled in) */
  header: string;
  footer: string;
  format?: PaperFormat;
  /** the PDF's document information and attached files (metadata.ts); none: Chromium's own */
  metadata?: PdfMetadata;
}

/** The page.pdf options packsmith prints with (the bench gives bare Chromium the same). */
export function pdfOptions(opts: PdfOptions): PDFOptions {
  return {
    format: opts.format ?? 'A4',
    printBackground: true,
    displayHeaderFooter: true,
    headerTemplate: opts.header,
    footerTemplate: opts.footer,
    // the pack's @page rules choose the sheet: its paper, and landscape for the board schedules
    preferCSSPageSize: true,
    margin: { top: '18mm', bottom: '16mm', left: '14mm', right: '14mm' },
    tagged: true,
    outline: true,
    // The load event has waited for the fonts layout asked for (system fonts, or data: fonts of a
    // theme). Puppeteer's own wait runs a script on the page, which has JavaScript off, and on a
    // large pack (300 circuits and up) it never returned: the print stalled with Chromium idle.
    waitForFonts: false,
  };
}

/**
 * How long one pack may take to load and print, grown with its HTML: two minutes, and two more
 * per MB (a 2,000-circuit pack is about 20 MB and prints in minutes; this allows ten times that).
 * It only stops a print that hangs: no pack, however large, is refused for its size.
 */
export const printBudgetMs = (htmlBytes: number): number => 120_000 + Math.ceil((htmlBytes / 1_048_576) * 120_000);

/** A file's size, 0 where it cannot be read (the page load then says why). */
const sizeOf = (path: string): number => {
  try {
    return statSync(path).size;
  } catch {
    return 0;
  }
};

/** `work` or, when it has not settled within `ms`, an error naming what took too long. */
export async function withinBudget<T>(work: Promise<T>, ms: number, what: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const expired = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`${what} took more than ${Math.round(ms / 1000)} s (allowed for its size), so it was stopped`)), ms);
  });
  try {
    return await Promise.race([work, expired]);
  } finally {
    clearTimeout(timer);
  }
}

/** A page that prints packs: no JavaScript, and only the file being printed may load. */
export interface PrintPage {
  page: Page;
  print(htmlPath: string, opts: PdfOptions): Promise<{ pdf: Uint8Array; refused: string[] }>;
}

/** When a pack prints in parts: above `single` bytes of HTML, in parts of about `part` bytes. */
export interface PartSizes { single: number; part: number }
const PART_SIZES: PartSizes = { single: SINGLE_PRINT_BYTES, part: PART_BYTES };

/** A page that loads only the file it prints, with no JavaScript; what it refused, in `refused`. */
async function guarded(page: Page, refused: string[]): Promise<PrintFile> {
  await page.setJavaScriptEnabled(false);
  await page.setRequestInterception(true);
  let own: string | null = null;
  let navigation: string | null = null;
  page.on('request', (req) => {
    const url = req.url();
    const navigating = req.isNavigationRequest() && req.frame() === page.mainFrame();
    if (navigating ? url === own && navigation === null : url === own || url.startsWith('data:')) void req.continue();
    else {
      refused.push(url);
      if (navigating && url !== own) navigation ??= url;
      void req.abort('blockedbyclient');
    }
  });
  const away = (): Error | null =>
    navigation === null ? null : new Error(`the pack ${own} tries to open ${navigation.slice(0, 120)} (a meta refresh or link in a template?); packsmith prints only the pack itself, so it was not printed`);
  /** Load one file and print it (the pack, or one of its parts). */
  return async (path: string, options: PDFOptions): Promise<Uint8Array> => {
    own = pathToFileURL(path).href;
    navigation = null;
    await page.goto(own, { waitUntil: 'load', timeout: 0 });
    let err = away();
    if (err) throw err;
    let pdf: Uint8Array;
    try {
      pdf = await page.pdf({ ...options, timeout: 0 });
    } catch (e) {
      throw away() ?? e; // the refused navigation is the cause worth naming
    }
    err = away();
    if (err || page.url() !== own) throw err ?? new Error(`the pack ${own} left its page for ${page.url()}; it was not printed`);
    return pdf;
  };
}

export async function preparePage(page: Page, sizes: PartSizes = PART_SIZES): Promise<PrintPage> {
  const refused: string[] = [];
  const printFile = await guarded(page, refused);
  /**
   * Each part of a large pack prints on a new page of its own, closed after it: its renderer
   * process ends with it, so the memory one part's layout took is returned before the next.
   */
  const printPart: PrintFile = async (path, options) => {
    const fresh = await page.browser().newPage();
    try {
      return await (await guarded(fresh, refused))(path, options);
    } finally {
      await fresh.close();
    }
  };
  return {
    page,
    async print(htmlPath, opts) {
      refused.length = 0;
      // Puppeteer's own limits (30 s a step) are lifted; one watchdog scaled to the pack covers the whole print.
      const size = sizeOf(htmlPath);
      const budget = printBudgetMs(size);
      const work = async () => {
        const options = pdfOptions(opts);
        if (size > sizes.single) return { pdf: await printInParts(printPart, htmlPath, options, opts.metadata, sizes.part), refused: [...refused] };
        const pdf = await printFile(htmlPath, options);
        return { pdf: opts.metadata ? await setPdfMetadata(pdf, opts.metadata) : pdf, refused: [...refused] };
      };
      return withinBudget(work(), budget, `printing ${htmlPath}`);
    },
  };
}

/** Print one HTML file on a page of its own; returns the PDF bytes and the requests that were refused. */
export async function printPdf(browser: Browser, htmlPath: string, opts: PdfOptions, sizes?: PartSizes): Promise<{ pdf: Uint8Array; refused: string[] }> {
  const page = await browser.newPage();
  try {
    return await (await preparePage(page, sizes)).print(htmlPath, opts);
  } finally {
    await page.close();
  }
}
