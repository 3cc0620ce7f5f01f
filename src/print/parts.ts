// A large pack's HTML cut into parts that each print on their own, so Chromium holds one part's
// layout at a time instead of the whole pack's (a 500-circuit pack, 5.7 MB of HTML, took 1.9 GB
// in its renderer alone). A cut falls only between two blocks of a container whose content may
// be split (the body, a section or div, a table's rows, a bulleted list), never after a heading
// (which must stay with what follows it). The next part reopens the elements the cut was inside,
// with a table's column groups and header row, so a long table keeps its header on every sheet.
// A part starts on a new sheet: a pack printed in parts may have a few more pages than in one.

/** One part: a whole HTML document, and the levels (1–6) of its headings in order. */
export interface HtmlPart {
  html: string;
  headings: number[];
}

/** Elements that never have a closing tag. */
const VOID = new Set(['area', 'base', 'br', 'col', 'embed', 'hr', 'img', 'input', 'link', 'meta', 'source', 'track', 'wbr']);
/** Containers whose children may go to different parts. An <ol> is not one: its numbers would restart. */
const SPLITTABLE = new Set(['body', 'section', 'div', 'tbody', 'ul']);
/** What a reopened table repeats. */
const REPEATED = new Set(['colgroup', 'thead']);

interface Open {
  name: string;
  /** its opening tag, as written */
  tag: string;
  /** where its opening tag starts */
  start: number;
  /** a table's column groups and header row, repeated where the table is reopened */
  repeated: string[];
}

const TAG = /<!--[\s\S]*?-->|<(\/?)([a-zA-Z][a-zA-Z0-9-]*)\b[^>]*?(\/?)>/g;

/**
 * Cut `html` (a whole document) into parts of about `partBytes` of body each; a pack no larger
 * than that stays one part, its HTML unchanged.
 */
export function splitPack(html: string, partBytes: number): HtmlPart[] {
  const bodyOpen = /<body\b[^>]*>/.exec(html);
  const bodyClose = html.lastIndexOf('</body>');
  if (!bodyOpen || bodyClose < 0 || html.length <= partBytes) return [{ html, headings: headingLevels(html) }];
  const head = html.slice(0, bodyOpen.index + bodyOpen[0].length);
  const tail = html.slice(bodyClose);
  const start = bodyOpen.index + bodyOpen[0].length;

  const bodies: string[] = [];
  const stack: Open[] = [{ name: 'body', tag: '', start, repeated: [] }];
  let partStart = start;
  let reopened = '';
  let lastClosedHeading = -1; // where the last heading closed, if nothing came after it
  const cut = (at: number) => {
    const inner = stack.slice(1);
    const body = reopened + html.slice(partStart, at) + inner.map((o) => `</${o.name}>`).reverse().join('');
    bodies.push(body);
    reopened = inner.map((o) => o.tag + o.repeated.join('')).join('');
    partStart = at;
  };

  TAG.lastIndex = start;
  for (let m = TAG.exec(html); m && m.index < bodyClose; m = TAG.exec(html)) {
    if (m[2] === undefined) continue; // a comment
    const name = m[2].toLowerCase();
    const closing = m[1] === '/';
    if (closing) {
      const i = stack.map((o) => o.name).lastIndexOf(name);
      if (i <= 0) continue; // a stray closing tag: the browser ignores it too
      const [closed] = stack.splice(i);
      const parent = stack[stack.length - 1]!;
      if (parent.name === 'table' && REPEATED.has(name)) parent.repeated.push(html.slice(closed!.start, TAG.lastIndex));
      lastClosedHeading = /^h[1-6]$/.test(name) ? TAG.lastIndex : -1;
      continue;
    }
    const parent = stack[stack.length - 1]!;
    const big = m.index - partStart + reopened.length >= partBytes;
    if (big && SPLITTABLE.has(parent.name) && !afterHeading(html, lastClosedHeading, m.index)) cut(m.index);
    lastClosedHeading = -1;
    if (m[3] === '/' || VOID.has(name)) continue;
    stack.push({ name, tag: m[0], start: m.index, repeated: [] });
  }
  cut(bodyClose);
  if (bodies.length === 1) return [{ html, headings: headingLevels(html) }];
  const linked = new Set(Array.from(html.matchAll(LINK), (m) => m[1]!));
  return bodies.map((body) => ({ html: head + body + linkTargets(body, linked) + tail, headings: headingLevels(body) }));
}

const LINK = /<a\b[^>]*\bhref="#([^"]+)"/g;
const ID = /<[a-zA-Z][^>]*?\sid="([^"]+)"/g;

/**
 * Chromium keeps a link only where its target is in the same document, and names a target (a
 * destination other parts' links can reach once joined) only where a link in the document
 * points at it. So each part gets, out of sight: a link to each of its own elements that any
 * part links to, and an empty stand-in for each element elsewhere that its own links point at
 * (a stand-in has no box, so it names no destination; the joined PDF takes the real one).
 */
function linkTargets(body: string, linked: Set<string>): string {
  const own = new Set(Array.from(body.matchAll(ID), (m) => m[1]!));
  const links = [...own].filter((id) => linked.has(id)).map((id) => `<a href="#${id}"></a>`);
  const wanted = new Set(Array.from(body.matchAll(LINK), (m) => m[1]!));
  const standIns = [...wanted].filter((id) => !own.has(id)).map((id) => `<span id="${id}"></span>`);
  return `<div style="display:none">${links.join('')}${standIns.join('')}</div>`;
}

/** Only white space between the end of a heading and here. */
const afterHeading = (html: string, headingEnd: number, at: number): boolean => headingEnd >= 0 && html.slice(headingEnd, at).trim() === '';

/** The levels of a document's headings, in order (Chromium makes one bookmark of each). */
export function headingLevels(html: string): number[] {
  return Array.from(html.matchAll(/<h([1-6])\b/gi), (m) => Number(m[1]));
}
