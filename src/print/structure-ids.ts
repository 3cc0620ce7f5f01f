// Chromium names each element of a tagged PDF's structure tree after its DOM node id
// ("(node00000066)"), a counter of the whole renderer process: a page that printed another pack
// before, or pages printing side by side, give the same pack other numbers, so the same inputs
// gave other bytes from build to build. The ids are renumbered here by rank (the smallest becomes
// node00000001, and so on), which keeps their order (the ID tree's keys stay sorted) and their
// length (every byte offset of the file stays valid).
const ID = /\(node(\d{8})\)/g;

export function normaliseStructureIds(pdf: Uint8Array): Uint8Array {
  const text = Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength).toString('latin1');
  const ids = [...new Set(Array.from(text.matchAll(ID), (m) => m[1]!))].sort();
  if (ids.length === 0 || ids.length > 99_999_999) return pdf;
  const rank = new Map(ids.map((id, i) => [id, String(i + 1).padStart(8, '0')]));
  return Buffer.from(text.replace(ID, (_, id: string) => `(node${rank.get(id)!})`), 'latin1');
}
