// The running footer of a pack printed in parts (join.ts): Chromium's "page N of M" is right only
// within the print that drew it, so the footer alone is printed once over the whole pack
// (in-parts.ts) and each of its pages is drawn over the joined page of the same number, as a form
// XObject marked as an artifact (not part of the reading order, as in Chromium's own print).
import {
  PDFArray, PDFContext, PDFDict, PDFDocument, PDFName, PDFObjectCopier, PDFRawStream, PDFRef, ParseSpeeds, decodePDFRawStream, type PDFObject,
} from 'pdf-lib';

const N = (n: string) => PDFName.of(n);

/** The name the running footer's drawing has in each page's resources. */
const FOOTER = 'PsRunningFooter';

/** A joined page not yet written: its reference and its dictionary. */
export interface HeldPage { ref: PDFRef; dict: PDFDict }

/**
 * A page's resources, and their XObjects, as dictionaries of the page's own (the running footer
 * is added to them once every other object has been written).
 */
export function ownResources(ctx: PDFContext, res: PDFObject | undefined): PDFDict {
  const own = (res instanceof PDFRef ? ctx.lookupMaybe(res, PDFDict) : res instanceof PDFDict ? res : undefined)?.clone() ?? ctx.obj({});
  const xobjects = own.get(N('XObject'));
  if (xobjects instanceof PDFRef) own.set(N('XObject'), ctx.lookup(xobjects, PDFDict).clone());
  return own;
}

/** Draw page i of the footer prints over `pages[i]`, in `ctx`; throws where the counts differ. */
export async function drawFooters(ctx: PDFContext, pages: readonly HeldPage[], footers: readonly Uint8Array[]): Promise<void> {
  const before = ctx.register(ctx.flateStream('q\n'));
  const after = ctx.register(ctx.flateStream(`Q\n/Artifact BMC\nq\n/${FOOTER} Do\nQ\nEMC\n`));
  let i = 0;
  for (const footer of footers) {
    const src = await PDFDocument.load(footer, { updateMetadata: false, parseSpeed: ParseSpeeds.Fastest });
    const copier = PDFObjectCopier.for(src.context, ctx);
    for (const page of src.getPages()) {
      const own = pages[i++];
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
  if (i !== pages.length) throw new Error(`the running footer printed ${i} pages for a pack of ${pages.length}`);
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
