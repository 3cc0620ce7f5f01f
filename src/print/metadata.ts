// A printed PDF made reproducible and self-describing: Chromium's output differs run to run in
// its creation and modification dates, so both are set to the pack's date and the producer fields
// are fixed, and in the ids of its structure tree, which are renumbered (structure-ids.ts);
// title, author (the firm) and subject (the job) are set, and data.json rides along as an
// embedded file.
import type { PDFDocument } from 'pdf-lib';
import { normaliseStructureIds } from './structure-ids.js';
import { dayOf } from '../model/dates.js';

export interface PdfMetadata {
  title: string;
  /** the firm */
  author: string;
  /** the job */
  subject: string;
  keywords: string[];
  /** YYYY-MM-DD: the issue date (a draft: its last test date) */
  date: string;
  producer: string;
  creator: string;
  attachments: { name: string; bytes: Uint8Array; mimeType: string; description: string }[];
}

export async function setPdfMetadata(pdf: Uint8Array, meta: PdfMetadata): Promise<Uint8Array> {
  const { PDFDocument, ParseSpeeds } = await import('pdf-lib'); // loaded only by a run that prints
  const doc = await PDFDocument.load(normaliseStructureIds(pdf), { updateMetadata: false, parseSpeed: ParseSpeeds.Fastest });
  await applyMetadata(doc, meta);
  return doc.save(WITHOUT_PAUSES);
}

/**
 * pdf-lib pauses for a timer every 50 objects it writes (every 100 it parses: `ParseSpeeds.Fastest`
 * lifts that), at least a millisecond each, to keep a browser's page responsive; a build has no
 * page to keep responsive. The bytes written are the same.
 */
const WITHOUT_PAUSES = { objectsPerTick: Infinity } as const;

/** Set a document's information and attach its files. */
export async function applyMetadata(doc: PDFDocument, meta: PdfMetadata): Promise<void> {
  const when = dayOf(meta.date);
  doc.setTitle(meta.title);
  doc.setAuthor(meta.author);
  doc.setSubject(meta.subject);
  doc.setKeywords(meta.keywords);
  doc.setProducer(meta.producer);
  doc.setCreator(meta.creator);
  doc.setCreationDate(when);
  doc.setModificationDate(when);
  for (const a of meta.attachments) {
    await doc.attach(a.bytes, a.name, { mimeType: a.mimeType, description: a.description, creationDate: when, modificationDate: when });
  }
}
