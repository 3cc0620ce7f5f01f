// Bringing an open draft up to date in place: of two versions of a pack, the elements (by id)
// whose HTML changed; made the same in the old page, they must give exactly the new page, and
// where that cannot be trusted there is no patch (the page is loaded again).
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { copyFixture, edit, scratch } from '../helpers/archive.js';
import { LiveJobs } from '../../src/serve/jobs.js';
import { pagePatch, parsePage, type Keyed, type ParsedPage, type Replacement } from '../../src/serve/patch.js';

/** The old page's text with each replaced element's HTML swapped for the new one. */
function applied(old: ParsedPage, replace: Replacement[]): string {
  const spans = new Map<string, Keyed>();
  const walk = (k: Keyed) => { spans.set(k.id, k); k.children.forEach(walk); };
  walk(old.body);
  const cuts = replace.map((r) => ({ span: spans.get(r.id)!, html: r.html })).sort((a, b) => b.span.start - a.span.start);
  let text = old.text;
  for (const c of cuts) text = text.slice(0, c.span.start) + c.html + text.slice(c.span.end);
  return text;
}

const page = (body: string, head = '<title>t</title>') => `<!doctype html><html><head>${head}</head><body class="draft">${body}</body></html>`;
const patchOf = (a: string, b: string) => {
  const pa = parsePage(a);
  const pb = parsePage(b);
  return pa && pb ? pagePatch(pa, pb) : null;
};

describe('the patch between two drafts of a pack', () => {
  it('replaces just the parts a re-test changes, and gives exactly the new draft', () => {
    const root = scratch('serve-patch');
    const job = copyFixture('pack-job', root);
    const jobs = new LiveJobs({ root: join(root, 'projects'), out: join(root, 'out'), log: () => {} });
    jobs.rescan();
    jobs.render('pack-job');
    const before = jobs.get('pack-job')!.draft!.html;
    const from = jobs.get('pack-job')!.version;
    edit(job, 'readings/2026-03-06.csv', 'DB-A,1,0.9,>999,>999,500,ok,9.9', 'DB-A,1,0.9,>999,>999,500,ok,0.73');
    expect(jobs.render('pack-job')).toBe(true);
    const after = jobs.get('pack-job')!.draft!.html;

    const patch = jobs.patch('pack-job', from);
    expect(patch?.version).toBe(from + 1);
    const ids = patch!.replace.map((r) => r.id);
    // the circuit's own checks, and the board's results table, show the new reading
    expect(ids).toContain('circuit-DB-A-1');
    expect(patch!.replace.find((r) => r.id === 'circuit-DB-A-1')!.html).toContain('measured Zs 0.73 Ω');
    expect(ids).toContain('board-DB-A');
    // parts that do not depend on the reading are left as they are
    expect(ids).not.toContain('supply');
    expect(ids).not.toContain('circuit-DB-A-2');
    expect(applied(parsePage(before)!, patch!.replace)).toBe(after);
    // a page already current has nothing to do; one not kept any more is loaded again
    expect(jobs.patch('pack-job', from + 1)).toEqual({ version: from + 1, replace: [] });
    expect(jobs.patch('pack-job', from - 5)).toBeNull();
  });

  it('goes down to the smallest element with an id that changed', () => {
    const a = page('<section id="s"><h2>S</h2><div id="c1"><p>1 pass</p></div><div id="c2"><p>2 pass</p></div></section><section id="t"><p>x</p></section>');
    const b = page('<section id="s"><h2>S</h2><div id="c1"><p>1 pass</p></div><div id="c2"><p>2 fail</p></div></section><section id="t"><p>x</p></section>');
    expect(patchOf(a, b)).toEqual([{ id: 'c2', html: '<div id="c2"><p>2 fail</p></div>' }]);
    // a change to the section's own text (outside its children with an id) replaces the section
    const c = b.replace('<h2>S</h2>', '<h2>S!</h2>');
    expect(patchOf(a, c)!.map((r) => r.id)).toEqual(['s']);
  });

  it('reads SVG with self-closed elements, void elements, comments and raw text', () => {
    const body = (v: string) => `<!-- c --><div id="a"><br><img src="data:," alt=""><svg viewBox="0 0 1 1"><path d="M0 0"/><text>${v}</text></svg></div><textarea id="t"><div></textarea>`;
    expect(patchOf(page(body('1')), page(body('2')))).toEqual([{ id: 'a', html: '<div id="a"><br><img src="data:," alt=""><svg viewBox="0 0 1 1"><path d="M0 0"/><text>2</text></svg></div>' }]);
  });

  it('has no patch where the browser might build another tree, or the change lies outside every element with an id', () => {
    const good = page('<section id="s"><p>a</p></section>');
    expect(patchOf(good, page('<section id="s"><p>b</p></section>'))).not.toBeNull();
    expect(parsePage(page('<section id="s"><p>a</section>'))).toBeNull(); // an end tag that does not match
    expect(parsePage(page('<section id="s"><div/></section>'))).toBeNull(); // "/>" on an HTML element opens it
    expect(parsePage(page('<p id="x">a</p><p id="x">b</p>'))).toBeNull(); // an id used twice
    expect(parsePage(page('<p id="a&amp;b">a</p>'))).toBeNull(); // an id the browser would decode
    expect(parsePage(page('<section id="s">'))).toBeNull(); // left open
    expect(patchOf(good, page('<section id="s"><p>a</p></section>', '<title>u</title>'))).toBeNull(); // another head
    expect(patchOf(good, page('<section id="s"><p>a</p></section><p>new</p>'))).toBeNull(); // outside every id
    expect(patchOf(good, page('<section id="s"><style>p{}</style><p>a</p></section>'))).toBeNull(); // a style needs the page's nonce
    expect(patchOf(good, page('<section id="s"><script>1</script></section>'))).toBeNull();
  });
});
