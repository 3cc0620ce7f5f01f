// Reading a PDF's trees and keys while its objects are copied into another (join.ts): the number
// and name trees of ISO 32000-1 §7.9.7 and §7.9.6, a structure element's kids, and a numeric key
// moved by an offset.
import { PDFArray, PDFContext, PDFDict, PDFName, PDFNumber, PDFRef, type PDFObject } from 'pdf-lib';

const N = (n: string) => PDFName.of(n);

/** The references among a /K entry: one, or an array's. */
export function refsOf(k: PDFObject | undefined): PDFRef[] {
  if (k instanceof PDFRef) return [k];
  if (k instanceof PDFArray) return k.asArray().filter((x): x is PDFRef => x instanceof PDFRef);
  return [];
}

/** Add `by` to a dictionary's number under `key`, where it has one. */
export function shiftKey(d: PDFDict, key: string, by: number): void {
  const n = d.get(N(key));
  if (n instanceof PDFNumber) d.set(N(key), PDFNumber.of(n.asNumber() + by));
}

/** The entries of a number tree (its /Nums, and its /Kids' in order). */
export function numberTree(ctx: PDFContext, node: PDFObject | undefined): [number, PDFObject][] {
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
export function nameTree(ctx: PDFContext, node: PDFObject | undefined): [string, PDFObject][] {
  const d = node instanceof PDFRef ? ctx.lookup(node) : node;
  if (!(d instanceof PDFDict)) return [];
  const out: [string, PDFObject][] = [];
  const names = d.lookupMaybe(N('Names'), PDFArray);
  for (let i = 0; names && i + 1 < names.size(); i += 2) out.push([String(names.get(i)), names.get(i + 1)]);
  const kids = d.lookupMaybe(N('Kids'), PDFArray);
  for (let i = 0; kids && i < kids.size(); i++) out.push(...nameTree(ctx, kids.get(i)));
  return out;
}
