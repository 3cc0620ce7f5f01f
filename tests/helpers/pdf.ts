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
