// The joined pack's outline (join.ts): every part's bookmarks in order, each under the nearest
// one before it of a lower level, all open, as Chromium nests a pack printed whole
// (ISO 32000-1 §12.3.3).
import { PDFContext, PDFDict, PDFName, PDFNumber, PDFRef, type PDFObject } from 'pdf-lib';

const N = (n: string) => PDFName.of(n);

/** One bookmark: its title, where it leads, and its level (1 the highest). */
export interface Bookmark { title: PDFObject; dest: PDFObject | undefined; level: number }

/** The outline of `bookmarks`, registered in `ctx`: its root. */
export function outlineOf(ctx: PDFContext, bookmarks: readonly Bookmark[]): PDFRef {
  type Node = { dict: PDFDict; ref: PDFRef; level: number; children: Node[] };
  const top: Node = { dict: ctx.obj({ Type: 'Outlines' }), ref: ctx.nextRef(), level: 0, children: [] };
  const stack: Node[] = [top];
  for (const b of bookmarks) {
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
