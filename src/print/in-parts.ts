// A large pack printed part by part (parts.ts) and joined (join.ts), so the memory a print takes
// stays that of one part whatever the size of the pack. The parts print one after another with
// the running header; the running footer, which numbers the pages of the whole pack, is printed
// last on blank sheets of the same sizes and drawn over the joined pages.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { PDFOptions } from 'puppeteer-core';
import { splitPack } from './parts.js';
import { collectGarbage } from './collect.js';
import type { PageSize } from './join.js';
import type { PdfMetadata } from './metadata.js';

/**
 * A pack of more HTML than this (about 170 circuits) prints in parts of about PART_BYTES each
 * (about 45 circuits). Measured on a 1,000-circuit pack in 1 MB parts on one reused page, the
 * renderer held 1.2 GB and the whole tree peaked at 2.4 GB; Chromium's browser and utility
 * processes take about 0.6 GB whatever the pack. A 2,000-circuit pack peaked at 2,054 MB (sum of
 * RSS, node and Chromium) in 768 kB parts and at 1,868 MB in 512 kB parts, 6 % slower.
 */
export const SINGLE_PRINT_BYTES = 2 * 1_048_576;
export const PART_BYTES = 512 * 1024;

/** The running footer is printed for this many sheets at a time (800 at once took its renderer 0.6 GB). */
const FOOTER_SHEETS = 250;

/** Prints one HTML file with these page.pdf options. */
export type PrintFile = (htmlPath: string, options: PDFOptions) => Promise<Uint8Array>;

const EMPTY = '<span></span>';

/** Print `htmlPath` in parts of about `partBytes` and join them; the joined PDF. */
export async function printInParts(
  printFile: PrintFile, htmlPath: string, options: PDFOptions, meta: PdfMetadata | undefined, partBytes = PART_BYTES,
): Promise<Uint8Array> {
  const dir = mkdtempSync(join(tmpdir(), 'packsmith-parts-'));
  const joined = join(dir, 'joined.pdf');
  const { PdfJoiner } = await import('./join.js'); // pdf-lib, loaded only by a run that prints
  const joiner = new PdfJoiner(joined);
  try {
    // every part written out first: only their files and headings are held while they print,
    // not the pack's HTML and every part's (a part's text keeps the whole pack's alive)
    const parts = splitPack(readFileSync(htmlPath, 'utf8'), partBytes).map((part, i) => {
      const path = join(dir, `part-${i + 1}.html`);
      writeFileSync(path, part.html);
      return { path, headings: part.headings };
    });
    collectGarbage(); // the cutting's garbage (the pack's HTML and every part's) goes before Chromium lays out the first part
    for (const part of parts) {
      const pdf = await printFile(part.path, { ...options, footerTemplate: EMPTY });
      await joiner.add({ pdf, headings: part.headings });
      collectGarbage(); // the part's parsed objects, before the next part is parsed (collect.ts)
    }
    const footer = join(dir, 'footer.html');
    writeFileSync(footer, blankSheets(joiner.sizes()));
    // a few hundred sheets at a time: Chromium's page numbers stay those of the whole document
    const footers: Uint8Array[] = [];
    for (let first = 1; first <= joiner.pageCount; first += FOOTER_SHEETS) {
      const pageRanges = `${first}-${Math.min(joiner.pageCount, first + FOOTER_SHEETS - 1)}`;
      footers.push(await printFile(footer, { ...options, headerTemplate: EMPTY, tagged: false, outline: false, pageRanges }));
    }
    await joiner.finish(footers, meta);
    return readFileSync(joined);
  } finally {
    joiner.abandon();
    rmSync(dir, { recursive: true, force: true });
  }
}

/** A document of empty sheets, one of each size in turn, with the pack's margins. */
export function blankSheets(sizes: PageSize[]): string {
  const names = new Map<string, string>();
  const nameOf = (s: PageSize) => {
    const key = `${s.width.toFixed(2)}pt ${s.height.toFixed(2)}pt`;
    if (!names.has(key)) names.set(key, `s${names.size}`);
    return names.get(key)!;
  };
  const sheets = sizes.map((s, i) => `<div style="page:${nameOf(s)};height:1px${i ? ';break-before:page' : ''}"></div>`).join('\n');
  const pages = [...names].map(([size, name]) => `@page ${name} { size: ${size}; }`).join('\n');
  return `<!doctype html><html><head><meta charset="utf-8"><style>@page { margin: 18mm 14mm 16mm; }\n${pages}\nbody { margin: 0; }</style></head><body>\n${sheets}\n</body></html>`;
}
