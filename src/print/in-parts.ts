// A large pack printed part by part (parts.ts) and joined (join.ts), so the memory a print takes
// stays that of one part whatever the size of the pack. The parts print one after another with
// the running header; the running footer, which numbers the pages of the whole pack, is printed
// last on blank sheets of the same sizes and drawn over the joined pages.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { PDFOptions } from 'puppeteer-core';
import { splitPack } from './parts.js';
import type { PageSize } from './join.js';
import type { PdfMetadata } from './metadata.js';

/**
 * A pack of more HTML than this prints in parts of about PART_BYTES each (about 170 and 85
 * circuits): a part's print takes Chromium about 0.3 GB per MB of HTML besides its own 0.6 GB.
 */
export const SINGLE_PRINT_BYTES = 2 * 1_048_576;
export const PART_BYTES = 1_048_576;

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
    const parts = splitPack(readFileSync(htmlPath, 'utf8'), partBytes);
    for (const [i, part] of parts.entries()) {
      const path = join(dir, `part-${i + 1}.html`);
      writeFileSync(path, part.html);
      const pdf = await printFile(path, { ...options, footerTemplate: EMPTY });
      await joiner.add({ pdf, headings: part.headings });
    }
    const footer = join(dir, 'footer.html');
    writeFileSync(footer, blankSheets(joiner.sizes()));
    await joiner.finish(await printFile(footer, { ...options, headerTemplate: EMPTY, tagged: false, outline: false }), meta);
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
