// A printed PDF's metadata made reproducible: two PDFs that differ only in their dates come out
// byte-identical, carrying the pack's title, firm, job, date and data.json.
import { describe, expect, it } from 'vitest';
import { PDFDocument } from 'pdf-lib';
import { pdfInfo } from '../helpers/pdf.js';
import { setPdfMetadata, type PdfMetadata } from '../../src/print/metadata.js';
import { dayOf } from '../../src/model/dates.js';

async function printedAt(when: Date): Promise<Uint8Array> {
  const doc = await PDFDocument.create({ updateMetadata: false });
  doc.addPage([595, 842]);
  doc.setProducer('some printer');
  doc.setCreationDate(when);
  doc.setModificationDate(when);
  return doc.save();
}

const META: PdfMetadata = {
  title: 'Lantern Yard workshop additions — Revision 2',
  author: 'Brackwater Electrical Co-op',
  subject: 'archive-job',
  keywords: ['archive-job', 'Revision 2'],
  date: '2026-10-12',
  producer: 'packsmith 0.0.0-test',
  creator: 'packsmith',
  attachments: [{ name: 'data.json', bytes: Buffer.from('{"job":"archive-job"}\n'), mimeType: 'application/json', description: 'data' }],
};

describe('PDF metadata', () => {
  it('gives the same bytes whatever the printer wrote as its dates', async () => {
    const a = await setPdfMetadata(await printedAt(new Date('2026-12-01T09:15:02Z')), META);
    const b = await setPdfMetadata(await printedAt(new Date('2026-12-02T17:40:59Z')), META);
    expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true);
  });

  it('carries title, author, subject, the date as creation and modification date, and data.json', async () => {
    const pdf = await setPdfMetadata(await printedAt(new Date()), META);
    const { info, attachments } = await pdfInfo(pdf);
    expect(info).toMatchObject({
      Title: META.title, Author: META.author, Subject: 'archive-job', Producer: 'packsmith 0.0.0-test', Creator: 'packsmith',
      CreationDate: 'D:20261012000000Z', ModDate: 'D:20261012000000Z',
    });
    expect(attachments['data.json']!.toString()).toBe('{"job":"archive-job"}\n');
  });

  it('refuses a date that is not YYYY-MM-DD', () => {
    expect(dayOf('2026-10-12').toISOString()).toBe('2026-10-12T00:00:00.000Z');
    expect(() => dayOf('12/10/2026')).toThrow(/YYYY-MM-DD/);
  });
});
