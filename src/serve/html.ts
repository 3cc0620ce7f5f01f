// HTML written in code: every interpolated value is escaped unless it is already HTML made here.
export class Html {
  constructor(readonly text: string) {}
  toString(): string {
    return this.text;
  }
}

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
export const escapeHtml = (s: string): string => s.replace(/[&<>"']/g, (c) => ESCAPES[c]!);

function part(v: unknown): string {
  if (v instanceof Html) return v.text;
  if (Array.isArray(v)) return v.map(part).join('');
  if (v === null || v === undefined || v === false) return '';
  return escapeHtml(String(v));
}

/** html`<p>${text}</p>`: text escaped; Html values and arrays of them kept as they are. */
export function html(strings: TemplateStringsArray, ...values: unknown[]): Html {
  let out = strings[0]!;
  values.forEach((v, i) => {
    out += part(v) + strings[i + 1]!;
  });
  return new Html(out);
}

/** Text that is already HTML (packsmith's own, e.g. a rendered pack). */
export const trusted = (text: string): Html => new Html(text);
