// A large pack prints in parts that are joined into one PDF. The joined PDF must read as the pack
// printed whole: its pages numbered through the whole pack, the running header and footer on
// every page, the same bookmarks nested the same way, every link reaching its target, and one
// tagged structure (ISO 32000-1 §14.7 logical structure, §14.8 tagged PDF: a StructTreeRoot
// whose ParentTree maps every page's StructParents and every annotation's StructParent, and
// MarkInfo /Marked true). A small part size makes a small pack print in several parts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFNumber, PDFRef, PDFString } from 'pdf-lib';
import { build } from '../../src/build.js';
import { findChromium, launchBrowser, type PrintBrowser } from '../../src/print/browser.js';
import { pdfOptions, printPdf, type PdfOptions } from '../../src/print/pdf.js';
import { printInParts, type PrintFile } from '../../src/print/in-parts.js';
import { pathToFileURL } from 'node:url';
import { headingLevels, splitPack } from '../../src/print/parts.js';
import { pdfInfo, pdfText } from '../helpers/pdf.js';
import { pdfStructure, type OutlineItem } from '../helpers/pdf-structure.js';
import { removeTree, scratch } from '../helpers/archive.js';
import { explainPdfDifference, offPixelFlowText } from '../helpers/pdf-diff.js';
import { ROOT } from '../helpers/cli.js';

const N = (n: string) => PDFName.of(n);

describe('cutting a pack into parts', () => {
  const rows = Array.from({ length: 60 }, (_, i) => `<tr id="r${i + 1}"><td>row ${i + 1}</td></tr>`).join('\n');
  const html = `<!doctype html><html><head><style>td{}</style></head><body class="paper-A4">
<section id="summary"><h2>Summary</h2>
<table class="schedule"><colgroup><col></colgroup><thead><tr><th>Circuit</th></tr></thead><tbody>
${rows}
</tbody></table></section>
<section id="notes"><h2>Notes</h2><ol><li>one</li><li>two</li><li>three</li></ol><p><a href="#r1">first row</a></p></section>
</body></html>`;

  it('leaves a pack no larger than a part as it is', () => {
    expect(splitPack(html, html.length)).toEqual([{ html, headings: [2, 2] }]);
  });

  it('cuts a long table between rows and repeats its column groups and header row in the next part', () => {
    const parts = splitPack(html, 600);
    expect(parts.length).toBeGreaterThan(2);
    for (const p of parts) {
      expect(p.html.startsWith('<!doctype html><html><head><style>td{}</style></head><body class="paper-A4">')).toBe(true);
      expect(p.html.endsWith('</body></html>')).toBe(true);
      // every element the part opens it closes
      for (const tag of ['section', 'table', 'tbody', 'thead', 'tr', 'ol']) {
        expect(p.html.split(`<${tag}`).length, `${tag} in ${p.html}`).toBe(p.html.split(`</${tag}>`).length);
      }
    }
    const second = parts[1]!.html;
    expect(second).toContain('<section id="summary"><table class="schedule"><colgroup><col></colgroup><thead><tr><th>Circuit</th></tr></thead><tbody>');
    // every row once, in order
    const all = parts.map((p) => p.html).join('');
    expect(Array.from(all.matchAll(/row (\d+)</g), (m) => Number(m[1]))).toEqual(Array.from({ length: 60 }, (_, i) => i + 1));
    expect(parts.flatMap((p) => p.headings)).toEqual(headingLevels(html));
  });

  it('never leaves a heading at the end of a part, and never cuts a numbered list', () => {
    for (let size = 100; size < html.length; size += 37) {
      for (const p of splitPack(html, size)) {
        expect(p.html, `part size ${size}`).not.toMatch(/<\/h\d>\s*(<\/\w+>\s*)*<div style="display:none">/);
        expect((p.html.match(/<li>/g) ?? []).length % 3, `part size ${size}`).toBe(0);
      }
    }
  });

  it('gives a part the link targets it needs: a stand-in for an element elsewhere, a link to each of its own that others link to', () => {
    const parts = splitPack(html, 600);
    const last = parts[parts.length - 1]!.html;
    expect(last).toContain('<a href="#r1">first row</a>');
    expect(last).toMatch(/<div style="display:none">.*<span id="r1"><\/span><\/div><\/body>/);
    expect(parts[0]!.html).toMatch(/<div style="display:none"><a href="#r1"><\/a><\/div><\/body>/);
    expect(parts.slice(1).map((p) => p.html).join('')).not.toContain('<a href="#r1"></a>');
  });
});

describe('a pack printed in parts', () => {
  let browser: PrintBrowser;
  let whole: Uint8Array;
  let parts: Uint8Array;
  let partsAgain: Uint8Array;
  let joinedOnce: Uint8Array;
  let joinedAgain: Uint8Array;
  let html = '';
  const out = scratch('parts');
  const PART = 40_000; // bytes of HTML: the 150 kB pack prints in about five parts

  beforeAll(async () => {
    const chromium = findChromium();
    if (!chromium) throw new Error('no Chromium: run scripts/install-deps.sh (or set PACKSMITH_CHROME)');
    browser = await launchBrowser(chromium);
    let opts: PdfOptions | null = null;
    // the build prints the pack whole (kept as `whole`) and hands over its HTML and its running header and footer
    await build({
      jobs: [join(ROOT, 'projects/tannery-row-refit')], out, force: true, archive: join(out, 'no-archive'), log: () => {},
      printer: {
        print: async (path, o) => {
          html = path;
          opts = o;
          const printed = await printPdf(browser.browser, path, o);
          whole = printed.pdf;
          return printed;
        },
        room: async () => {},
        close: async () => {},
      },
    });
    parts = (await printPdf(browser.browser, html, opts!, { single: 0, part: PART })).pdf;
    partsAgain = (await printPdf(browser.browser, html, opts!, { single: 0, part: PART })).pdf;
    // the same printed parts and footers joined twice: what the joiner adds must not vary
    const printed: Uint8Array[] = [];
    const page = await browser.browser.newPage();
    const record: PrintFile = async (path, options) => {
      await page.goto(pathToFileURL(path).href, { waitUntil: 'load' });
      printed.push(await page.pdf({ ...options, timeout: 0 }));
      return printed.at(-1)!;
    };
    const meta = { title: 'T', author: 'A', subject: 'S', keywords: ['k'], date: '2026-11-20', producer: 'p', creator: 'c', attachments: [] };
    joinedOnce = await printInParts(record, html, pdfOptions(opts!), meta, PART);
    await page.close();
    let next = 0;
    joinedAgain = await printInParts(async () => printed[next++]!, html, pdfOptions(opts!), meta, PART);
  }, 180_000);
  afterAll(async () => {
    await browser?.close();
    removeTree(out);
  });

  it('is printed in several parts', () => {
    expect(splitPack(readFileSync(html, 'utf8'), PART).length).toBeGreaterThanOrEqual(3);
  });

  it('numbers its pages through the whole pack, with the running header and footer on every page', async () => {
    const { pages, text } = await pdfText(parts);
    // a part starts on a new sheet: a few more pages than the pack printed whole, never fewer
    expect(pages).toBeGreaterThanOrEqual((await pdfText(whole)).pages);
    text.forEach((t, i) => {
      expect(t).toContain('Tannery Row coffee house refit · job tannery-row-refit DRAFT');
      expect(t).toContain(`Quillon & Hart Electrical Ltd DRAFT page ${i + 1} of ${pages}`);
      expect(t.match(/page \d+ of \d+/g), t).toHaveLength(1);
    });
  });

  it('has the bookmarks of the pack printed whole, nested the same way', async () => {
    const shape = (items: OutlineItem[]): unknown => items.map((i) => [i.title, shape(i.items)]);
    const joined = (await pdfStructure(parts)).outline;
    expect(shape(joined)).toEqual(shape((await pdfStructure(whole)).outline));
    expect(joined[0]!.items.map((i) => i.title)).toContain('Appendix: the checks of each circuit');
  });

  it('is one tagged structure: one Document, every page and link annotation mapped by the parent tree, unique element ids', async () => {
    const { tagged, roles } = await pdfStructure(parts);
    expect(tagged).toBe(true);
    for (const role of ['Document', 'H1', 'H2', 'H3', 'H4', 'Table', 'TR', 'TH', 'TD', 'L', 'Link']) expect(roles, role).toContain(role);

    const doc = await PDFDocument.load(parts, { updateMetadata: false });
    const root = doc.catalog.lookup(N('StructTreeRoot'), PDFDict);
    const document = root.lookup(N('K'), PDFDict);
    expect(document.get(N('S'))).toBe(N('Document'));
    const kids = document.lookup(N('K'), PDFArray).asArray();
    for (const k of kids) expect(doc.context.lookup(k, PDFDict).get(N('P'))).toBe(root.get(N('K')));

    const nums = root.lookup(N('ParentTree'), PDFDict).lookup(N('Nums'), PDFArray).asArray();
    const keys = nums.filter((_, i) => i % 2 === 0).map((n) => (n as PDFNumber).asNumber());
    expect(keys).toEqual([...keys].sort((a, b) => a - b));
    expect(new Set(keys).size).toBe(keys.length);
    expect(root.lookup(N('ParentTreeNextKey'), PDFNumber).asNumber()).toBeGreaterThan(Math.max(...keys));
    const mapped = new Set(keys);
    for (const page of doc.getPages()) {
      expect(mapped.has(page.node.lookup(N('StructParents'), PDFNumber).asNumber())).toBe(true);
      const annots = page.node.lookupMaybe(N('Annots'), PDFArray);
      for (let i = 0; annots && i < annots.size(); i++) expect(mapped.has(annots.lookup(i, PDFDict).lookup(N('StructParent'), PDFNumber).asNumber())).toBe(true);
    }
    // a page's entry lists elements on that page (their /Pg or their parent's is the page)
    const firstPage = doc.getPages()[0]!;
    const entry = nums[keys.indexOf(firstPage.node.lookup(N('StructParents'), PDFNumber).asNumber()) * 2 + 1]!;
    const elems = (entry instanceof PDFRef ? doc.context.lookup(entry, PDFArray) : (entry as PDFArray)).asArray();
    expect(elems.length).toBeGreaterThan(0);

    const ids = root.lookup(N('IDTree'), PDFDict).lookup(N('Names'), PDFArray).asArray().filter((_, i) => i % 2 === 0).map((s) => (s as PDFString).asString());
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids).toEqual([...ids].sort());
    expect(doc.catalog.lookup(N('MarkInfo'), PDFDict).get(N('Marked'))).toBeDefined();
  });

  it('keeps every link of the pack printed whole, each reaching the page of its circuit', async () => {
    const links = async (bytes: Uint8Array) => {
      const doc = await PDFDocument.load(bytes, { updateMetadata: false });
      const dests = doc.catalog.lookup(N('Dests'), PDFDict);
      const pageOf = new Map(doc.getPages().map((p, i) => [p.ref.toString(), i]));
      const found: { name: string; page: number }[] = [];
      for (const page of doc.getPages()) {
        const annots = page.node.lookupMaybe(N('Annots'), PDFArray);
        for (let i = 0; annots && i < annots.size(); i++) {
          const name = annots.lookup(i, PDFDict).get(N('Dest'));
          expect(name).toBeInstanceOf(PDFName);
          const target = dests.lookup(name as PDFName, PDFArray);
          found.push({ name: (name as PDFName).decodeText(), page: pageOf.get(target.get(0).toString())! });
        }
      }
      return found;
    };
    const joined = await links(parts);
    expect(joined.map((l) => l.name)).toEqual((await links(whole)).map((l) => l.name));
    const { text } = await pdfText(parts);
    for (const l of joined) {
      const circuit = /^circuit-DB\d-(\d+)$/.exec(l.name);
      if (circuit) expect(text[l.page], l.name).toMatch(new RegExp(`Circuit ${circuit[1]} —`));
    }
  });

  it('carries the metadata and data.json of the pack printed whole', async () => {
    const joined = await pdfInfo(parts);
    const one = await pdfInfo(whole);
    expect(joined.info).toMatchObject({ Title: one.info.Title, Author: 'Quillon & Hart Electrical Ltd', Subject: 'tannery-row-refit', CreationDate: one.info.CreationDate, ModDate: one.info.ModDate, Producer: one.info.Producer });
    expect(joined.attachments['data.json']!.equals(one.attachments['data.json']!)).toBe(true);
  });

  it('joins the same printed parts into the same bytes', () => {
    const [a, b] = [join(out, 'joined-once.pdf'), join(out, 'joined-again.pdf')];
    writeFileSync(a, joinedOnce);
    writeFileSync(b, joinedAgain);
    expect(Buffer.from(joinedOnce).equals(Buffer.from(joinedAgain)), explainPdfDifference(a, b)).toBe(true);
  });

  it('prints the same pack in parts into the same bytes again (each part on a new page and renderer)', () => {
    const [a, b] = [join(out, 'parts-once.pdf'), join(out, 'parts-again.pdf')];
    writeFileSync(a, parts);
    writeFileSync(b, partsAgain);
    expect(Buffer.from(parts).equals(Buffer.from(partsAgain)), explainPdfDifference(a, b)).toBe(true);
  });

  it('puts every line of text on a whole pixel, so no print depends on how Chromium rounds a baseline', () => {
    // the demo pack holds re-test marks in every context they occur in (a superscript raised by
    // 0.4em printed 6 of them at y 2718.5469, one of which another print put at 2718)
    expect(offPixelFlowText(Buffer.from(whole))).toEqual([]);
    expect(offPixelFlowText(Buffer.from(parts))).toEqual([]);
  });
});
