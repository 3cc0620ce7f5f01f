// The PDFs of a pack's parts (parts.ts) joined into one, as if Chromium had printed the pack
// whole: the pages in order; one tagged structure (the parts' Document elements' children under
// one Document, the parent tree renumbered, the element ids renumbered in order); one outline
// built from every part's bookmarks, nested by heading level as Chromium nests them; every
// part's named destinations, so a link in one part reaches a heading in another; and the
// running footer ("page N of M") drawn from a print of the footer alone over the whole pack.
import {
  PDFArray, PDFDict, PDFDocument, PDFName, PDFNumber, PDFObjectCopier, PDFPage, PDFRef, PDFString,
  beginMarkedContent, endMarkedContent, type PDFContext, type PDFObject, type PDFPageLeaf,
} from 'pdf-lib';
import { normaliseStructureIds } from './structure-ids.js';

const N = (n: string) => PDFName.of(n);

/** One printed part: its PDF and the levels of its headings, in order. */
export interface PrintedPart {
  pdf: Uint8Array;
  headings: number[];
}

interface Bookmark { title: PDFObject; dest: PDFObject | undefined; level: number }

/** The sizes of the joined pages, in points, for the footer's own print. */
export type PageSize = { width: number; height: number };

export class PdfJoiner {
  readonly doc: PDFDocument;
  private readonly kids: PDFRef[] = [];
  private readonly parentTree: [number, PDFObject][] = [];
  private readonly ids: [string, PDFRef][] = [];
  private readonly bookmarks: Bookmark[] = [];
  private readonly dests = new Map<string, PDFObject>();
  private nextKey = 0;
  private lang: PDFObject | undefined;

  private constructor(doc: PDFDocument) {
    this.doc = doc;
  }

  static async create(): Promise<PdfJoiner> {
    return new PdfJoiner(await PDFDocument.create({ updateMetadata: false }));
  }

  get pageCount(): number {
    return this.doc.getPageCount();
  }

  sizes(): PageSize[] {
    return this.doc.getPages().map((p) => p.getSize());
  }

  /** Append one part's pages, structure, bookmarks and destinations. */
  async add(part: PrintedPart): Promise<void> {
    const src = await PDFDocument.load(normaliseStructureIds(part.pdf), { updateMetadata: false });
    const copier = PDFObjectCopier.for(src.context, this.doc.context);
    const offset = this.nextKey;
    const root = src.catalog.lookupMaybe(N('StructTreeRoot'), PDFDict);
    const docElem = root?.lookupMaybe(N('K'), PDFDict);
    // Cut the part's elements loose from its own Document (else copying one copies the whole tree).
    const partKids = docElem ? refsOf(docElem.get(N('K'))) : [];
    for (const k of partKids) src.context.lookup(k, PDFDict).delete(N('P'));
    this.lang ??= docElem?.get(N('Lang'));

    for (const page of src.getPages()) {
      const ref = copier.copy(page.ref);
      const node = this.doc.context.lookup(ref) as PDFPageLeaf;
      shiftKey(node, 'StructParents', offset);
      const annots = node.lookupMaybe(N('Annots'), PDFArray);
      for (let i = 0; annots && i < annots.size(); i++) {
        const a = annots.lookup(i);
        if (a instanceof PDFDict) shiftKey(a, 'StructParent', offset);
      }
      this.doc.addPage(PDFPage.of(node, ref, this.doc));
    }
    this.kids.push(...partKids.map((k) => copier.copy(k)));
    if (root) {
      for (const [key, value] of numberTree(src.context, root.get(N('ParentTree')))) this.parentTree.push([key + offset, copier.copy(value)]);
      const next = root.lookupMaybe(N('ParentTreeNextKey'), PDFNumber)?.asNumber() ?? 0;
      this.nextKey = offset + next;
      for (const [, value] of nameTree(src.context, root.get(N('IDTree')))) {
        if (value instanceof PDFRef) this.ids.push([String(this.ids.length + 1).padStart(8, '0'), copier.copy(value)]);
      }
    }
    this.addBookmarks(src, copier, part.headings);
    const dests = src.catalog.lookupMaybe(N('Dests'), PDFDict);
    for (const [name, value] of dests?.entries() ?? []) {
      if (!this.dests.has(name.decodeText())) this.dests.set(name.decodeText(), copier.copy(value));
    }
  }

  /** The part's bookmarks in order, each with the level of its heading (else its depth in the part's outline). */
  private addBookmarks(src: PDFDocument, copier: PDFObjectCopier, headings: number[]): void {
    const found: { item: PDFDict; depth: number }[] = [];
    const walk = (d: PDFDict | undefined, depth: number) => {
      for (let it = d?.lookupMaybe(N('First'), PDFDict); it; it = it.lookupMaybe(N('Next'), PDFDict)) {
        found.push({ item: it, depth });
        walk(it, depth + 1);
      }
    };
    walk(src.catalog.lookupMaybe(N('Outlines'), PDFDict), 1);
    const byHeading = found.length === headings.length;
    found.forEach(({ item, depth }, i) => {
      const dest = item.get(N('Dest'));
      this.bookmarks.push({ title: item.get(N('Title'))!, dest: dest && copier.copy(dest), level: byHeading ? headings[i]! : depth });
    });
  }

  /** Draw page i of `footer` (the running footer alone, printed for every page) over page i. */
  async overlay(footer: Uint8Array): Promise<void> {
    const src = await PDFDocument.load(footer, { updateMetadata: false });
    const pages = this.doc.getPages();
    if (src.getPageCount() !== pages.length) throw new Error(`the running footer printed ${src.getPageCount()} pages for a pack of ${pages.length}`);
    const embedded = await this.doc.embedPages(src.getPages());
    pages.forEach((page, i) => {
      // an artifact: the footer is not part of the pack's reading order (as in Chromium's own print)
      page.pushOperators(beginMarkedContent('Artifact'));
      page.drawPage(embedded[i]!, { x: 0, y: 0 });
      page.pushOperators(endMarkedContent());
    });
  }

  /** The joined document's structure tree, outline and destinations; the bytes. */
  async save(): Promise<Uint8Array> {
    const ctx = this.doc.context;
    const cat = this.doc.catalog;
    const rootRef = ctx.nextRef();
    const docRef = ctx.register(ctx.obj({ Type: 'StructElem', S: 'Document', P: rootRef, K: this.kids }));
    if (this.lang) ctx.lookup(docRef, PDFDict).set(N('Lang'), this.lang);
    for (const k of this.kids) ctx.lookup(k, PDFDict).set(N('P'), docRef);
    const names: PDFObject[] = [];
    for (const [id, ref] of this.ids) {
      const s = PDFString.of(`node${id}`);
      ctx.lookup(ref, PDFDict).set(N('ID'), s);
      names.push(s, ref);
    }
    const nums: PDFObject[] = this.parentTree.flatMap(([k, v]) => [PDFNumber.of(k), v]);
    ctx.assign(rootRef, ctx.obj({
      Type: 'StructTreeRoot', K: docRef, ParentTreeNextKey: this.nextKey,
      ParentTree: ctx.register(ctx.obj({ Nums: nums })), IDTree: ctx.register(ctx.obj({ Names: names })),
    }));
    const dests = ctx.obj({});
    for (const [name, value] of this.dests) dests.set(N(name), value);
    cat.set(N('Dests'), ctx.register(dests));
    cat.set(N('MarkInfo'), ctx.obj({ Type: 'MarkInfo', Marked: true }));
    cat.set(N('StructTreeRoot'), rootRef);
    if (this.bookmarks.length) cat.set(N('Outlines'), this.outline());
    cat.set(N('ViewerPreferences'), ctx.obj({ Type: 'ViewerPreferences', DisplayDocTitle: true }));
    if (this.lang) cat.set(N('Lang'), this.lang);
    return this.doc.save({ useObjectStreams: false });
  }

  /** The outline: each bookmark under the nearest one before it of a lower level, all open. */
  private outline(): PDFRef {
    const ctx = this.doc.context;
    type Node = { dict: PDFDict; ref: PDFRef; level: number; children: Node[] };
    const top: Node = { dict: ctx.obj({ Type: 'Outlines' }), ref: ctx.nextRef(), level: 0, children: [] };
    const stack: Node[] = [top];
    for (const b of this.bookmarks) {
      while (stack[stack.length - 1]!.level >= b.level) stack.pop();
      const dict = ctx.obj({ Title: b.title });
      if (b.dest) dict.set(N('Dest'), b.dest);
      const node: Node = { dict, ref: ctx.register(dict), level: b.level, children: [] };
      stack[stack.length - 1]!.children.push(node);
      stack.push(node);
    }
    const link = (n: Node): number => {
      let count = 0;
      n.children.forEach((c, i) => {
        c.dict.set(N('Parent'), n.ref);
        if (i > 0) c.dict.set(N('Prev'), n.children[i - 1]!.ref);
        if (i < n.children.length - 1) c.dict.set(N('Next'), n.children[i + 1]!.ref);
        count += 1 + link(c);
      });
      if (n.children.length) {
        n.dict.set(N('First'), n.children[0]!.ref);
        n.dict.set(N('Last'), n.children[n.children.length - 1]!.ref);
        n.dict.set(N('Count'), PDFNumber.of(count));
      }
      return count;
    };
    link(top);
    ctx.assign(top.ref, top.dict);
    return top.ref;
  }
}

function refsOf(k: PDFObject | undefined): PDFRef[] {
  if (k instanceof PDFRef) return [k];
  if (k instanceof PDFArray) return k.asArray().filter((x): x is PDFRef => x instanceof PDFRef);
  return [];
}

function shiftKey(d: PDFDict, key: string, by: number): void {
  const n = d.get(N(key));
  if (n instanceof PDFNumber) d.set(N(key), PDFNumber.of(n.asNumber() + by));
}

/** The entries of a number tree (its /Nums, and its /Kids' in order). */
function numberTree(ctx: PDFContext, node: PDFObject | undefined): [number, PDFObject][] {
  const d = node instanceof PDFRef ? ctx.lookup(node) : node;
  if (!(d instanceof PDFDict)) return [];
  const out: [number, PDFObject][] = [];
  const nums = d.lookupMaybe(N('Nums'), PDFArray);
  for (let i = 0; nums && i + 1 < nums.size(); i += 2) out.push([(nums.lookup(i, PDFNumber)).asNumber(), nums.get(i + 1)]);
  const kids = d.lookupMaybe(N('Kids'), PDFArray);
  for (let i = 0; kids && i < kids.size(); i++) out.push(...numberTree(ctx, kids.get(i)));
  return out;
}

/** The entries of a name tree (its /Names, and its /Kids' in order). */
function nameTree(ctx: PDFContext, node: PDFObject | undefined): [string, PDFObject][] {
  const d = node instanceof PDFRef ? ctx.lookup(node) : node;
  if (!(d instanceof PDFDict)) return [];
  const out: [string, PDFObject][] = [];
  const names = d.lookupMaybe(N('Names'), PDFArray);
  for (let i = 0; names && i + 1 < names.size(); i += 2) out.push([String(names.get(i)), names.get(i + 1)]);
  const kids = d.lookupMaybe(N('Kids'), PDFArray);
  for (let i = 0; kids && i < kids.size(); i++) out.push(...nameTree(ctx, kids.get(i)));
  return out;
}
