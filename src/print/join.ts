// The PDFs of a pack's parts (parts.ts) joined into one, as if Chromium had printed the pack
// whole: the pages in order; one tagged structure (the parts' Document elements' children under
// one Document, the parent tree renumbered, the element ids renumbered in order); one outline
// built from every part's bookmarks, nested by heading level as Chromium nests them; every
// part's named destinations, so a link in one part reaches a heading in another; the running
// footer ("page N of M") drawn from a print of the footer alone over the whole pack; and the
// pack's metadata and data.json (metadata.ts).
//
// The joined file is written as the parts arrive: each part's objects are renumbered and written
// out, and only what the end needs stays in memory (page dictionaries, the parent tree's and
// outline's entries, ids, destinations). Holding the whole joined document instead took node
// 0.3 GB for a 500-circuit pack, growing with every part.
import { closeSync, openSync, writeSync } from 'node:fs';
import {
  PDFArray, PDFContext, PDFDict, PDFDocument, PDFName, PDFNumber, PDFObjectCopier, PDFRawStream, PDFRef, PDFString, ParseSpeeds,
  decodePDFRawStream, type PDFObject,
} from 'pdf-lib';
import { normaliseStructureIds } from './structure-ids.js';
import { applyMetadata, type PdfMetadata } from './metadata.js';

const N = (n: string) => PDFName.of(n);

/** One printed part: its PDF and the levels of its headings, in order. */
export interface PrintedPart {
  pdf: Uint8Array;
  headings: number[];
}

/** A page's size in points. */
export type PageSize = { width: number; height: number };

interface Bookmark { title: PDFObject; dest: PDFObject | undefined; level: number }
interface HeldPage { ref: PDFRef; dict: PDFDict; size: PageSize }

/** The name the running footer's drawing has in each page's resources. */
const FOOTER = 'PsRunningFooter';

export class PdfJoiner {
  private readonly fd: number;
  private written = 0;
  /** byte offset of each object, by object number */
  private readonly offsets: number[] = [];
  private nextObject = 1;
  private readonly pagesRef = this.reserve();
  private readonly documentRef = this.reserve();
  private readonly pages: HeldPage[] = [];
  private readonly kids: PDFRef[] = [];
  private readonly parentTree: PDFObject[] = [];
  private readonly ids: PDFObject[] = [];
  private readonly bookmarks: Bookmark[] = [];
  private readonly dests = new Map<string, PDFObject>();
  private nextKey = 0;
  private lang: PDFObject | undefined;

  /** Start the joined PDF at `path`. */
  constructor(path: string) {
    this.fd = openSync(path, 'w');
    // the binary comment tells a reader the file holds binary data (ISO 32000-1 §7.5.2)
    this.write(Buffer.from('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n\n', 'latin1'));
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
    const ctx = this.context();
    const copier = PDFObjectCopier.for(src.context, ctx);
    const offset = this.nextKey;
    const root = src.catalog.lookupMaybe(N('StructTreeRoot'), PDFDict);
    const docElem = root?.lookupMaybe(N('K'), PDFDict);
    // Cut the part's elements loose from its own Document (else copying one copies the whole tree).
    const partKids = docElem ? refsOf(docElem.get(N('K'))) : [];
    for (const k of partKids) src.context.lookup(k, PDFDict).delete(N('P'));
    this.lang ??= docElem?.get(N('Lang'));

    const held: HeldPage[] = [];
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
    this.flush(ctx, (ref) => !pageRefs.has(ref));
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
    const ctx = this.context();
    // an artifact: the footer is not part of the pack's reading order (as in Chromium's own print)
    const before = ctx.register(ctx.flateStream('q\n'));
    const after = ctx.register(ctx.flateStream(`Q\n/Artifact BMC\nq\n/${FOOTER} Do\nQ\nEMC\n`));
    let i = 0;
    for (const footer of footers) {
      const src = await PDFDocument.load(footer, { updateMetadata: false, parseSpeed: ParseSpeeds.Fastest });
      const copier = PDFObjectCopier.for(src.context, ctx);
      for (const page of src.getPages()) {
        const own = this.pages[i++];
        if (!own) break;
        const form = formOf(ctx, copier, page.node);
        const res = own.dict.get(N('Resources')) as PDFDict;
        const xobjects = (res.get(N('XObject')) as PDFDict | undefined) ?? ctx.obj({});
        xobjects.set(N(FOOTER), form);
        res.set(N('XObject'), xobjects);
        const contents = own.dict.get(N('Contents'));
        own.dict.set(N('Contents'), ctx.obj([before, ...(contents instanceof PDFArray ? contents.asArray() : contents ? [contents] : []), after]));
        ctx.assign(own.ref, own.dict);
      }
    }
    if (i !== this.pages.length) throw new Error(`the running footer printed ${i} pages for a pack of ${this.pages.length}`);
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
    if (this.bookmarks.length) catalog.set(N('Outlines'), this.outline(ctx));
    catalog.set(N('ViewerPreferences'), ctx.obj({ Type: 'ViewerPreferences', DisplayDocTitle: true }));
    if (this.lang) catalog.set(N('Lang'), this.lang);
    const catalogRef = ctx.register(catalog);
    this.flush(ctx, () => true);
    this.trailer(catalogRef, info);
  }

  /** The outline: each bookmark under the nearest one before it of a lower level, all open. */
  private outline(ctx: PDFContext): PDFRef {
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

  /** A context whose new objects are numbered after every object so far. */
  private context(): PDFContext {
    const ctx = PDFContext.create();
    ctx.largestObjectNumber = this.nextObject - 1;
    return ctx;
  }

  private reserve(): PDFRef {
    return PDFRef.of(this.nextObject++);
  }

  /** Write the context's objects that `now` accepts (and forget them). */
  private flush(ctx: PDFContext, now: (ref: PDFRef) => boolean): void {
    for (const [ref, obj] of ctx.enumerateIndirectObjects()) {
      if (!now(ref)) continue;
      const bytes = new Uint8Array(obj.sizeInBytes());
      obj.copyBytesInto(bytes, 0);
      this.offsets[ref.objectNumber] = this.written;
      this.write(Buffer.from(`${ref.objectNumber} 0 obj\n`, 'latin1'));
      this.write(bytes);
      this.write(Buffer.from('\nendobj\n\n', 'latin1'));
      ctx.delete(ref);
    }
    this.nextObject = Math.max(this.nextObject, ctx.largestObjectNumber + 1);
  }

  /** The cross-reference table and trailer (ISO 32000-1 §7.5.4, §7.5.5); closes the file. */
  private trailer(root: PDFRef, info: PDFRef | undefined): void {
    const size = this.nextObject;
    const rows = ['xref', `0 ${size}`, '0000000000 65535 f '];
    for (let n = 1; n < size; n++) {
      const at = this.offsets[n];
      rows.push(at === undefined ? '0000000000 00000 f ' : `${String(at).padStart(10, '0')} 00000 n `);
    }
    const start = this.written;
    this.write(Buffer.from(`${rows.join('\n')}\ntrailer\n<<\n/Size ${size}\n/Root ${root.toString()}${info ? `\n/Info ${info.toString()}` : ''}\n>>\n\nstartxref\n${start}\n%%EOF`, 'latin1'));
    closeSync(this.fd);
  }

  private write(bytes: Uint8Array): void {
    writeSync(this.fd, bytes);
    this.written += bytes.length;
  }

  /** Close the file without finishing it (a part failed). */
  abandon(): void {
    try {
      closeSync(this.fd);
    } catch {
      /* already closed */
    }
  }
}

/** A page of the footer's print as a form XObject in `ctx`: its content, its resources, its box. */
function formOf(ctx: PDFContext, copier: PDFObjectCopier, page: PDFDict): PDFRef {
  const contents = page.lookup(N('Contents'));
  const streams = contents instanceof PDFArray ? contents.asArray().map((c) => page.context.lookup(c)) : [contents];
  const decoded = streams.map((s) => (s instanceof PDFRawStream ? decodePDFRawStream(s).decode() : new Uint8Array()));
  const joined = Buffer.concat(decoded.flatMap((d) => [Buffer.from(d), Buffer.from('\n')]));
  const box = page.lookup(N('MediaBox'), PDFArray);
  return ctx.register(ctx.flateStream(joined, {
    Type: 'XObject', Subtype: 'Form', BBox: copier.copy(box), Resources: copier.copy(page.get(N('Resources'))!),
  }));
}

/**
 * A page's resources, and their XObjects, as dictionaries of the page's own (the running footer
 * is added to them once every other object has been written).
 */
function ownResources(ctx: PDFContext, res: PDFObject | undefined): PDFDict {
  const own = (res instanceof PDFRef ? ctx.lookupMaybe(res, PDFDict) : res instanceof PDFDict ? res : undefined)?.clone() ?? ctx.obj({});
  const xobjects = own.get(N('XObject'));
  if (xobjects instanceof PDFRef) own.set(N('XObject'), ctx.lookup(xobjects, PDFDict).clone());
  return own;
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
  for (let i = 0; nums && i + 1 < nums.size(); i += 2) out.push([nums.lookup(i, PDFNumber).asNumber(), nums.get(i + 1)]);
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
