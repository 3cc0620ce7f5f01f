// The PDFs of a pack's parts (parts.ts) joined into one, as if Chromium had printed the pack
// whole: the pages in order; one tagged structure (the parts' Document elements' children under
// one Document, the parent tree renumbered, the element ids renumbered in order); one outline
// built from every part's bookmarks, nested by heading level as Chromium nests them; every
// part's named destinations, so a link in one part reaches a heading in another; the running
// footer ("page N of M") drawn from a print of the footer alone over the whole pack; and the
// pack's metadata and data.json (metadata.ts).
//
// The joined file is written as the parts arrive (object-writer.ts): each part's objects are
// renumbered and written out, and only what the end needs stays in memory (page dictionaries, the
// parent tree's and outline's entries, ids, destinations). Holding the whole joined document
// instead took node 0.3 GB for a 500-circuit pack, growing with every part. The outline is built
// in outline.ts, the running footer drawn in running-footer.ts.
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFNumber, PDFObjectCopier, PDFRef, PDFString, ParseSpeeds, type PDFObject } from 'pdf-lib';
import { normaliseStructureIds } from './structure-ids.js';
import { applyMetadata, type PdfMetadata } from './metadata.js';
import { ObjectWriter } from './object-writer.js';
import { outlineOf, type Bookmark } from './outline.js';
import { drawFooters, ownResources, type HeldPage } from './running-footer.js';
import { nameTree, numberTree, refsOf, shiftKey } from './pdf-trees.js';

const N = (n: string) => PDFName.of(n);

/** One printed part: its PDF and the levels of its headings, in order. */
export interface PrintedPart {
  pdf: Uint8Array;
  headings: number[];
}

/** A page's size in points. */
export type PageSize = { width: number; height: number };

export class PdfJoiner {
  private readonly out: ObjectWriter;
  private readonly pagesRef: PDFRef;
  private readonly documentRef: PDFRef;
  private readonly pages: (HeldPage & { size: PageSize })[] = [];
  private readonly kids: PDFRef[] = [];
  private readonly parentTree: PDFObject[] = [];
  private readonly ids: PDFObject[] = [];
  private readonly bookmarks: Bookmark[] = [];
  private readonly dests = new Map<string, PDFObject>();
  private nextKey = 0;
  private lang: PDFObject | undefined;

  /** Start the joined PDF at `path`. */
  constructor(path: string) {
    this.out = new ObjectWriter(path);
    this.pagesRef = this.out.reserve();
    this.documentRef = this.out.reserve();
  }

  get pageCount(): number {
    return this.pages.length;
  }

  sizes(): PageSize[] {
    return this.pages.map((p) => p.size);
  }

  /** Append one part's pages, structure, bookmarks and destinations; its other objects are written out. */
  async add(part: PrintedPart): Promise<void> {
    const src = await PDFDocument.load(normaliseStructureIds(part.pdf), { updateMetadata: false, parseSpeed: ParseSpeeds.Fastest });
    const ctx = this.out.context();
    const copier = PDFObjectCopier.for(src.context, ctx);
    const offset = this.nextKey;
    const root = src.catalog.lookupMaybe(N('StructTreeRoot'), PDFDict);
    const docElem = root?.lookupMaybe(N('K'), PDFDict);
    // Cut the part's elements loose from its own Document (else copying one copies the whole tree).
    const partKids = docElem ? refsOf(docElem.get(N('K'))) : [];
    for (const k of partKids) src.context.lookup(k, PDFDict).delete(N('P'));
    this.lang ??= docElem?.get(N('Lang'));

    const held: (HeldPage & { size: PageSize })[] = [];
    for (const page of src.getPages()) {
      const ref = copier.copy(page.ref);
      const dict = ctx.lookup(ref, PDFDict);
      shiftKey(dict, 'StructParents', offset);
      const annots = dict.lookupMaybe(N('Annots'), PDFArray);
      for (let i = 0; annots && i < annots.size(); i++) {
        const a = annots.lookup(i);
        if (a instanceof PDFDict) shiftKey(a, 'StructParent', offset);
      }
      dict.set(N('Parent'), this.pagesRef);
      dict.set(N('Resources'), ownResources(ctx, dict.get(N('Resources'))));
      held.push({ ref, dict, size: page.getSize() });
    }
    for (const k of partKids) {
      const ref = copier.copy(k);
      ctx.lookup(ref, PDFDict).set(N('P'), this.documentRef);
      this.kids.push(ref);
    }
    if (root) {
      for (const [key, value] of numberTree(src.context, root.get(N('ParentTree')))) this.parentTree.push(PDFNumber.of(key + offset), copier.copy(value));
      this.nextKey = offset + (root.lookupMaybe(N('ParentTreeNextKey'), PDFNumber)?.asNumber() ?? 0);
      for (const [, value] of nameTree(src.context, root.get(N('IDTree')))) {
        if (!(value instanceof PDFRef)) continue;
        // ids renumbered in order through the whole pack (each part's run from node00000001)
        const id = PDFString.of(`node${String(this.ids.length / 2 + 1).padStart(8, '0')}`);
        const ref = copier.copy(value);
        ctx.lookup(ref, PDFDict).set(N('ID'), id);
        this.ids.push(id, ref);
      }
    }
    this.addBookmarks(src, copier, part.headings);
    for (const [name, value] of src.catalog.lookupMaybe(N('Dests'), PDFDict)?.entries() ?? []) {
      if (!this.dests.has(name.decodeText())) this.dests.set(name.decodeText(), copier.copy(value));
    }
    // Every object but the pages now goes to the file; a page waits for the running footer.
    const pageRefs = new Set(held.map((p) => p.ref));
    this.out.flush(ctx, (ref) => !pageRefs.has(ref));
    this.pages.push(...held);
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

  /**
   * Finish the file: page i of `footers` (the running footer alone, printed for every page) drawn
   * over page i, then the page tree, structure tree, outline, destinations and metadata.
   */
  async finish(footers: Uint8Array[], meta: PdfMetadata | undefined): Promise<void> {
    const ctx = this.out.context();
    await drawFooters(ctx, this.pages, footers);
    ctx.assign(this.pagesRef, ctx.obj({ Type: 'Pages', Kids: this.pages.map((p) => p.ref), Count: this.pages.length }));

    const rootRef = ctx.nextRef();
    const document = ctx.obj({ Type: 'StructElem', S: 'Document', P: rootRef, K: this.kids });
    if (this.lang) document.set(N('Lang'), this.lang);
    ctx.assign(this.documentRef, document);
    ctx.assign(rootRef, ctx.obj({
      Type: 'StructTreeRoot', K: this.documentRef, ParentTreeNextKey: this.nextKey,
      ParentTree: ctx.register(ctx.obj({ Nums: this.parentTree })), IDTree: ctx.register(ctx.obj({ Names: this.ids })),
    }));

    // the catalog and document information, made by pdf-lib as for a pack printed whole
    const tail = await PDFDocument.create({ updateMetadata: false });
    if (meta) await applyMetadata(tail, meta);
    await tail.flush();
    const made = PDFObjectCopier.for(tail.context, ctx);
    const catalog = ctx.lookup(made.copy(tail.context.trailerInfo.Root as PDFRef), PDFDict);
    const info = tail.context.trailerInfo.Info instanceof PDFRef ? made.copy(tail.context.trailerInfo.Info) : undefined;
    const emptyPages = catalog.get(N('Pages'));
    if (emptyPages instanceof PDFRef) ctx.delete(emptyPages);
    catalog.set(N('Pages'), this.pagesRef);
    const dests = ctx.obj({});
    for (const [name, value] of this.dests) dests.set(N(name), value);
    catalog.set(N('Dests'), ctx.register(dests));
    catalog.set(N('MarkInfo'), ctx.obj({ Type: 'MarkInfo', Marked: true }));
    catalog.set(N('StructTreeRoot'), rootRef);
    if (this.bookmarks.length) catalog.set(N('Outlines'), outlineOf(ctx, this.bookmarks));
    catalog.set(N('ViewerPreferences'), ctx.obj({ Type: 'ViewerPreferences', DisplayDocTitle: true }));
    if (this.lang) catalog.set(N('Lang'), this.lang);
    const catalogRef = ctx.register(catalog);
    this.out.flush(ctx, () => true);
    this.out.trailer(catalogRef, info);
  }

  /** Close the file without finishing it (a part failed). */
  abandon(): void {
    this.out.abandon();
  }
}
