// Notes that are only headings and paragraphs of plain words (the common case: "## Scope" and a
// few sentences) give the same HTML as the full Markdown pipeline without running it: parsing a
// short note with every extension loaded costs more than the rest of its pack's summary. The
// shape accepted is narrow on purpose: any character, line or run of lines that Markdown could
// read as anything but a heading or plain paragraph text (list markers, emphasis, links, HTML,
// entities, tables, setext underlines, indents, trailing spaces, "www."...) sends the note to the
// full pipeline. tests/render/markdown.test.ts compares both on many notes, in and out of the shape.

/** Characters besides letters and digits that mean nothing to Markdown inside a line of text. */
const SYMBOLS = String.raw`,.;:()'"?!%+\-°±×·–—≤≥‘’“”`;
/** Words of letters, digits and those symbols, one space between words, starting with a letter (or a digit in a heading). */
const WORDS = String.raw`[\p{L}\p{N}${SYMBOLS}]*(?: [\p{L}\p{N}${SYMBOLS}]+)*`;
const HEADING = new RegExp(String.raw`^(#{1,6}) ([\p{L}\p{N}]${WORDS})$`, 'u');
const TEXT_LINE = new RegExp(String.raw`^\p{L}${WORDS}$`, 'u');
/** GFM reads "www." as the start of a link, in any case. */
const LINK_START = /www\./i;

type Block = { depth: number; text: string } | string[];

/**
 * The HTML markdown.ts gives for these notes (headings moved as there), or null where the notes
 * are not only headings and paragraphs of plain words.
 */
export function plainNotesHtml(markdown: string, topLevel: number): string | null {
  // a heading level that is not a whole number is left to the pipeline
  if (!Number.isInteger(topLevel) || LINK_START.test(markdown)) return null;
  const blocks: Block[] = [];
  let paragraph: string[] | null = null;
  for (const line of markdown.split('\n')) {
    if (line === '') {
      paragraph = null;
      continue;
    }
    const h = HEADING.exec(line);
    if (h) {
      blocks.push({ depth: h[1]!.length, text: h[2]! });
      paragraph = null;
    } else if (!TEXT_LINE.test(line)) {
      return null;
    } else if (paragraph) {
      paragraph.push(line);
    } else {
      paragraph = [line];
      blocks.push(paragraph);
    }
  }
  // as markdown.ts's shiftHeadings: the shallowest heading becomes topLevel, the others keep their distance
  let shallowest = 7;
  for (const b of blocks) if (!Array.isArray(b)) shallowest = Math.min(shallowest, b.depth);
  const shift = topLevel && shallowest < 7 ? topLevel - shallowest : 0;
  return blocks.map((b) => {
    if (Array.isArray(b)) return `<p>${b.join('\n')}</p>`;
    const depth = Math.max(1, Math.min(6, b.depth + shift));
    return `<h${depth}>${b.text}</h${depth}>`;
  }).join('\n');
}
