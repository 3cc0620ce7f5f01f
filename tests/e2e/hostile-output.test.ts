// Where packsmith writes, and what its pages let a browser do: the output folder is claimed
// (never a filesystem root, never a folder of other files), no symlink inside it is followed, every
// page opens with a restrictive CSP, a theme's CSS cannot close its element, and a job folder's
// name is never a link scheme.
import { describe, expect, it } from 'vitest';
import { cpSync, existsSync, mkdirSync, readFileSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { run, ROOT } from '../helpers/cli.js';
import { scratch } from '../helpers/archive.js';
import { claimOut, OutputFolderError } from '../../src/archive/out.js';
import { CSP, cspMeta } from '../../src/render/csp.js';
import { SITE_SCRIPT_SHA256 } from '../../src/archive/site.js';

const HTML_ONLY = { PACKSMITH_CHROME: '/nonexistent/chromium' };
const DEMO = join(ROOT, 'projects/tannery-row-refit');
/** The first element of the page's <head>. */
const firstInHead = (html: string): string => /<head[^>]*>\s*(<[^>]+>)/i.exec(html)?.[1] ?? '';
const CSP_TAG = `<meta http-equiv="Content-Security-Policy" content="${CSP}">`;

describe('the output folder', () => {
  it('is never the root of a filesystem', async () => {
    expect(() => claimOut('/')).toThrow(OutputFolderError);
    expect(() => claimOut('/')).toThrow(/root of a filesystem/);
    // the reproducer: `build --out /` wrote /index.html
    const job = join(scratch('root-out'), 'projects', 'tannery-row-refit');
    cpSync(DEMO, job, { recursive: true });
    for (const args of [['build', job], ['issue', job, '--by', 'A. Tester', '--accept-open-items', '--archive', scratch('root-archive')]]) {
      const r = await run([...args, '--out', '/'], HTML_ONLY);
      expect(r.code, r.stderr).toBe(2);
      expect(r.stderr).toMatch(/--out "\/" is the root of a filesystem/);
    }
  });

  it('is refused when it holds files packsmith did not write, and they are left alone', async () => {
    const out = scratch('foreign');
    writeFileSync(join(out, 'thesis.docx'), 'mine');
    const job = join(scratch('foreign-job'), 'projects', 'tannery-row-refit');
    cpSync(DEMO, job, { recursive: true });
    for (const args of [['build', DEMO], ['issue', job, '--by', 'A. Tester', '--accept-open-items', '--archive', scratch('foreign-archive')]]) {
      const r = await run([...args, '--out', out], HTML_ONLY);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/holds files packsmith did not write \(thesis\.docx\)/);
      expect(readdirSync(out)).toEqual(['thesis.docx']);
    }
  });

  it('is accepted when packsmith wrote it before (marked, or holding only drafts and revisions)', async () => {
    const out = scratch('own');
    expect((await run(['build', DEMO, '--out', out], HTML_ONLY)).code).toBe(0);
    expect(existsSync(join(out, '.packsmith-out'))).toBe(true);
    expect((await run(['build', DEMO, '--out', out, '--force'], HTML_ONLY)).code).toBe(0);
    const legacy = scratch('legacy');
    cpSync(join(out, 'tannery-row-refit'), join(legacy, 'tannery-row-refit'), { recursive: true });
    cpSync(join(out, 'index.html'), join(legacy, 'index.html'));
    expect((await run(['build', DEMO, '--out', legacy], HTML_ONLY)).code).toBe(0);
  });

  it('never follows a symlink planted at out/<job>/draft', async () => {
    const out = scratch('planted');
    const elsewhere = scratch('elsewhere');
    writeFileSync(join(out, '.packsmith-out'), '');
    mkdirSync(join(out, 'tannery-row-refit'));
    symlinkSync(elsewhere, join(out, 'tannery-row-refit', 'draft'));
    const r = await run(['build', DEMO, '--out', out], HTML_ONLY);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/draft is a symlink, which packsmith did not make/);
    expect(readdirSync(elsewhere)).toEqual([]);
  });
});

describe('pages packsmith writes', () => {
  it("keeps a theme's CSS inside its <style> and opens every pack with the CSP", async () => {
    const theme = scratch('theme');
    writeFileSync(join(theme, 'theme.css'), 'p{color:red}</style><meta http-equiv="refresh" content="0;url=https://example.invalid/"><style>');
    const out = scratch('css-out');
    expect((await run(['build', DEMO, '--out', out, '--theme', theme], HTML_ONLY)).code).toBe(0);
    const html = readFileSync(join(out, 'tannery-row-refit/draft/pack.html'), 'utf8');
    expect(html).not.toMatch(/<meta http-equiv="refresh"/i);
    expect(html).toContain('p{color:red}\\3C /style>');
    expect(firstInHead(html)).toBe(CSP_TAG);
    expect(html.match(/<\/style>/g)?.length).toBe(html.match(/<style>/g)?.length);
  });

  it('makes a job folder named javascript:alert(1) a relative link, and opens the site pages with the CSP', async () => {
    const firm = scratch('js-name');
    const job = join(firm, 'projects', 'javascript:alert(1)');
    cpSync(DEMO, job, { recursive: true });
    const out = join(firm, 'out');
    expect((await run(['build', job, '--out', out], HTML_ONLY)).code).toBe(0);
    const index = readFileSync(join(out, 'index.html'), 'utf8');
    expect(index).not.toMatch(/href="javascript:/i);
    expect(index).toContain('href="./javascript%3Aalert(1)/index.html"');
    // The index allows exactly one script, its own search and sort, by hash; nothing else runs.
    expect(firstInHead(index)).toBe(cspMeta([SITE_SCRIPT_SHA256]));
    expect(index).toMatch(/script-src 'sha256-[A-Za-z0-9+/=]+';/);
    expect(firstInHead(readFileSync(join(out, 'javascript:alert(1)/index.html'), 'utf8'))).toBe(CSP_TAG);
  });
});
