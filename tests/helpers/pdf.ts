// Read a PDF's text with pdf.js (a library, not a screenshot).
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

export async function pdfText(bytes: Uint8Array): Promise<{ pages: number; text: string[] }> {
  const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
  const text: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const page = await doc.getPage(i);
    const content = await page.getTextContent();
    text.push(content.items.map((it) => ('str' in it ? it.str : '')).join(' ').replace(/\s+/g, ' '));
  }
  await doc.destroy();
  return { pages: doc.numPages, text };
}

/** A PDF's document information (Title, Author, dates...) and its embedded files, by name. */
export async function pdfInfo(bytes: Uint8Array): Promise<{ info: Record<string, unknown>; attachments: Record<string, Buffer> }> {
  const doc = await getDocument({ data: new Uint8Array(bytes), isEvalSupported: false }).promise;
  const { info } = await doc.getMetadata();
  const found = ((await doc.getAttachments()) ?? {}) as Record<string, { content: Uint8Array }>;
  await doc.destroy();
  return { info: info as Record<string, unknown>, attachments: Object.fromEntries(Object.entries(found).map(([k, v]) => [k, Buffer.from(v.content)])) };
}

export interface PageWords {
  width: number;
  height: number;
  /** each run of text: its string, its font size (the height of its box, in pt) and its top, from the page's top edge */
  words: { str: string; size: number; top: number }[];
}

/** The word boxes of every page, as pdf.js reads them. */
export async function pdfWords(bytes: Uint8Array): Promise<PageWords[]> {
  const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
  const pages: PageWords[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const page = await doc.getPage(i);
    const { width, height } = page.getViewport({ scale: 1 });
    const content = await page.getTextContent();
    const words = content.items.flatMap((it) => {
      if (!('str' in it) || !it.str.trim()) return [];
      const [, , c, d, , f] = it.transform as number[];
      return [{ str: it.str, size: Math.hypot(c!, d!), top: height - f! }];
    });
    pages.push({ width, height, words });
  }
  await doc.destroy();
  return pages;
}
