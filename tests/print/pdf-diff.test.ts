// The reproducibility tests' account of a difference: it must find a moved line of text inside a
// deflated page stream, and say nothing of identical files.
import { describe, expect, it } from 'vitest';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { explainPdfDifference } from '../helpers/pdf-diff.js';
import { scratch } from '../helpers/archive.js';

async function onePage(y: number): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  doc.addPage([200, 200]).drawText('Zs 0.81 ohm', { x: 20, y, font, size: 10 });
  doc.setCreationDate(new Date(0));
  doc.setModificationDate(new Date(0));
  return doc.save();
}

describe('explainPdfDifference', () => {
  it('names the differing stream and line of two PDFs whose text sits 3/64 unit apart, and says nothing of identical ones', async () => {
    const dir = scratch('pdf-diff');
    const [a, b, c] = ['a.pdf', 'b.pdf', 'c.pdf'].map((f) => join(dir, f));
    writeFileSync(a!, await onePage(100));
    writeFileSync(b!, await onePage(100 - 3 / 64));
    writeFileSync(c!, await onePage(100));
    expect(explainPdfDifference(a!, c!)).toBe('');
    const said = explainPdfDifference(a!, b!);
    expect(said).toMatch(/\d of \d streams differ/);
    expect(said).toMatch(/stream 1, line \d+: "1 0 0 1 20 100 Tm" against "1 0 0 1 20 99\.953125 Tm"/);
    expect(said).toContain('both kept in');
  });
});
