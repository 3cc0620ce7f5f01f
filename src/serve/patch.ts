// An open draft brought up to date in place: of two versions of a pack's HTML, the elements (known
// by their id) whose HTML differs, so the page swaps just those instead of loading ~0.5 MB again.
//
// The HTML is read by a small strict scanner, not a full HTML parser. Where it cannot be sure the
// browser would build the same tree — an end tag that does not match, an element left open, a
// `/>` on an HTML element, an id used twice or written with a character reference, a changed
// <head>, a block holding a <style> or <script> (which would need the page's nonce), a change
// outside every element with an id — there is no patch and the page is loaded again in full.

export interface Keyed {
  /** the element's id; '' for the body's content */
  id: string;
  /** its HTML is text.slice(start, end) */
  start: number;
  end: number;
  /** the elements with an id nearest below it, in order */
  children: Keyed[];
}

export interface ParsedPage {
  text: string;
  /** everything before the body's content (the <head> and the <body> tag) */
  before: string;
  /** everything after it (from </body>) */
  after: string;
  body: Keyed;
}

export interface Replacement {
  id: string;
  html: string;
}

const VOID = new Set(['area', 'base', 'br', 'col', 'embed', 'hr', 'img', 'input', 'link', 'meta', 'source', 'track', 'wbr']);
/** elements whose content is text up to their end tag */
const RAW = new Set(['script', 'style', 'textarea', 'title', 'xmp', 'noscript', 'iframe', 'noembed', 'noframes', 'plaintext']);
/** elements under which `/>` closes an element (SVG and MathML) */
const FOREIGN = new Set(['svg', 'math']);

const TOKEN = /<!--[\s\S]*?-->|<![^>]*>|<\/([A-Za-z][\w:-]*)\s*>|<([A-Za-z][\w:-]*)((?:\s+[^\s"'>/=]+(?:\s*=\s*(?:"[^"]*"|'[^']*'|[^\s"'=<>`]+))?)*)\s*(\/?)>/g;
const ID = /(?:^|\s)id\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"'=<>`]+))/i;

interface Open {
  name: string;
  keyed: Keyed | null;
  foreign: boolean;
}

/** The elements with an id of a page, nested as they are; null where the page is not plain enough to patch safely. */
export function parsePage(text: string): ParsedPage | null {
  const stack: Open[] = [];
  const ids = new Set<string>();
  let body: Keyed | null = null;
  let bodyEnd = -1;
  /** the nearest element with an id being read (or the body's content) */
  const holder = (): Keyed | null => {
    for (let i = stack.length - 1; i >= 0; i--) if (stack[i]!.keyed) return stack[i]!.keyed;
    return null;
  };
  let lower: string | null = null; // the page in lower case, made when a raw text element needs its end found
  TOKEN.lastIndex = 0;
  for (let m = TOKEN.exec(text); m; m = TOKEN.exec(text)) {
    const [token, closing, opening, attrs, slash] = m;
    if (closing !== undefined) {
      const top = stack.pop();
      if (!top || top.name !== closing.toLowerCase()) return null;
      if (top.name === 'body' && top.keyed) bodyEnd = m.index;
      if (top.keyed) top.keyed.end = top.name === 'body' ? m.index : m.index + token.length;
      continue;
    }
    if (opening === undefined) continue; // a comment or a doctype
    const name = opening.toLowerCase();
    const foreign = FOREIGN.has(name) || (stack.at(-1)?.foreign ?? false);
    const idMatch = ID.exec(attrs ?? '');
    let keyed: Keyed | null = null;
    if (name === 'body') {
      if (body) return null;
      body = keyed = { id: '', start: m.index + token.length, end: -1, children: [] };
    } else if (idMatch && body && bodyEnd < 0) {
      const id = idMatch[1] ?? idMatch[2] ?? idMatch[3]!;
      if (id === '' || id.includes('&') || ids.has(id)) return null;
      ids.add(id);
      keyed = { id, start: m.index, end: m.index + token.length, children: [] };
      const parent = holder();
      if (!parent) return null;
      parent.children.push(keyed);
    }
    if (VOID.has(name)) continue;
    if (slash) {
      if (!foreign) return null; // `<div/>` opens a div in HTML: the browser's tree would differ from this one
      continue;
    }
    if (RAW.has(name) && !foreign) {
      lower ??= text.toLowerCase();
      const close = lower.indexOf(`</${name}`, TOKEN.lastIndex);
      if (close < 0) return null;
      TOKEN.lastIndex = close;
    }
    stack.push({ name, keyed, foreign });
  }
  if (stack.length > 0 || !body || bodyEnd < 0) return null;
  const b: Keyed = body;
  return { text, before: text.slice(0, b.start), after: text.slice(bodyEnd), body: b };
}

const html = (p: ParsedPage, k: Keyed): string => p.text.slice(k.start, k.end);

/** The element's HTML with each child element with an id standing as its id alone. */
function skeleton(p: ParsedPage, k: Keyed): string {
  let out = '';
  let at = k.start;
  for (const c of k.children) {
    out += `${p.text.slice(at, c.start)}\u0000${c.id}\u0000`;
    at = c.end;
  }
  return out + p.text.slice(at, k.end);
}

/** Find what to replace below `o` (old) and `n` (new), the same element; false where only the whole element will do. */
function walk(a: ParsedPage, o: Keyed, b: ParsedPage, n: Keyed, out: Replacement[]): boolean {
  if (html(a, o) === html(b, n)) return true;
  if (skeleton(a, o) !== skeleton(b, n)) return false; // the element's own text changed, or its children did not stay the same
  for (let i = 0; i < n.children.length; i++) {
    const oc = o.children[i]!;
    const nc = n.children[i]!;
    if (!walk(a, oc, b, nc, out)) out.push({ id: nc.id, html: html(b, nc) });
  }
  return true;
}

/** The elements to replace to turn page `a` into page `b`, or null when it must be loaded in full. */
export function pagePatch(a: ParsedPage, b: ParsedPage): Replacement[] | null {
  if (a.before !== b.before || a.after !== b.after) return null;
  const out: Replacement[] = [];
  if (!walk(a, a.body, b, b.body, out)) return null;
  // a <style> or <script> needs the page's nonce (and a script would not run): load the page again
  if (out.some((r) => /<(style|script)[\s>/]/i.test(r.html))) return null;
  return out;
}
