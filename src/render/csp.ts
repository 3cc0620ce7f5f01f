// Every page packsmith writes (packs and the archive's site pages) opens its <head> with this
// Content-Security-Policy: no script, no request other than data: images and fonts, no form, no
// <base>, styles only inline. Several policies are all enforced, so a theme's own policy can only
// tighten it. Stylesheets are inlined with every "<" escaped, so no CSS can close its element.
export const CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; font-src data:; base-uri 'none'; form-action 'none'";

export const CSP_META = `<meta http-equiv="Content-Security-Policy" content="${CSP}">`;

/** The policy allowing, besides, exactly the inline scripts whose hashes are given ("sha256-..."). */
export const cspMeta = (scriptHashes: readonly string[] = []): string =>
  scriptHashes.length === 0 ? CSP_META : `<meta http-equiv="Content-Security-Policy" content="${CSP.replace("default-src 'none';", `default-src 'none'; script-src ${scriptHashes.map((h) => `'${h}'`).join(' ')};`)}">`;

/**
 * CSS made safe to inline in a <style> element: "<" written as the CSS escape \3C (the same
 * character to CSS, in strings, url() and everywhere else), so "</style>" or "<!--" cannot occur.
 */
export const inlineCss = (css: string): string => css.replace(/</g, '\\3C ');

const HEAD = /<head(?:\s[^>]*)?>/i;
const HTML = /^(?:\s|<!--[\s\S]*?-->)*(?:<!doctype[^>]*>)?(?:\s|<!--[\s\S]*?-->)*(?:<html(?:\s[^>]*)?>)?/i;

/** The page with the policy as the first element of its <head> (a <head> is added where it has none). */
export function withCsp(html: string, scriptHashes: readonly string[] = []): string {
  const meta = cspMeta(scriptHashes);
  const m = HEAD.exec(html);
  if (m) {
    const at = m.index + m[0].length;
    return `${html.slice(0, at)}\n${meta}${html.slice(at)}`;
  }
  const at = HTML.exec(html)?.[0].length ?? 0;
  return `${html.slice(0, at)}<head>${meta}</head>${html.slice(at)}`;
}

/**
 * A page template's source with the policy put after its <head>, where that tag stands in the
 * template's literal text before any "{{": every page it renders then starts with the same bytes
 * `withCsp` would give, without searching each page. Null where the <head> is not there (or not
 * before the first "{{"): the page then goes through `withCsp`.
 */
export function cspInTemplate(source: string): string | null {
  const m = HEAD.exec(source);
  if (!m) return null;
  const at = m.index + m[0].length;
  const mustache = source.indexOf('{{');
  if (mustache !== -1 && mustache < at) return null;
  return `${source.slice(0, at)}\n${CSP_META}${source.slice(at)}`;
}
