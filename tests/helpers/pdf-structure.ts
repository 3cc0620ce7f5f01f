// What a PDF holds besides its text: outline, tagging, fonts, page sizes (pdf.js and pdf-lib).
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { PDFDict, PDFDocument, PDFName } from 'pdf-lib';

export interface OutlineItem { title: string; items: OutlineItem[] }

export async function pdfStructure(bytes: Uint8Array) {
  const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
  const raw = (await doc.getOutline()) ?? [];
  const outline = (items: typeof raw): OutlineItem[] => items.map((i) => ({ title: i.title, items: outline(i.items ?? []) }));
  const markInfo = await doc.getMarkInfo();
  const roles = new Set<string>();
  for (let p = 1; p <= doc.numPages; p++) {
    const walk = (n: { role?: string; children?: unknown[] } | null) => {
      if (!n) return;
      if (n.role) roles.add(n.role);
      for (const c of n.children ?? []) walk(c as { role?: string; children?: unknown[] });
    };
    walk((await (await doc.getPage(p)).getStructTree()) as { role?: string; children?: unknown[] } | null);
  }
  await doc.destroy();

  const lib = await PDFDocument.load(bytes, { updateMetadata: false });
  const fonts = new Set<string>();
  for (const [, obj] of lib.context.enumerateIndirectObjects()) {
    if (obj instanceof PDFDict && obj.get(PDFName.of('Type')) === PDFName.of('Font')) {
      const base = obj.get(PDFName.of('BaseFont'));
      if (base instanceof PDFName) fonts.add(base.decodeText().replace(/^[A-Z]{6}\+/, ''));
    }
  }
  const sizes = lib.getPages().map((p) => p.getSize());
  return { outline: outline(raw), tagged: markInfo?.Marked === true, roles, fonts, sizes };
}
