// Firm themes over the built-in templates, and templates that fail loudly.
import { describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadJob } from '../../src/job.js';
import { readJob } from '../../src/load/job.js';
import { createEngine, TemplateError } from '../../src/render/engine.js';
import { renderPack, renderPackFiles } from '../../src/render/pack.js';
import { templateFiles } from '../../src/render/theme.js';

const OPTS = { revisionLabel: 'DRAFT', draft: true, date: '2026-03-06' };
const fixture = (() => {
  const j = loadJob('tests/fixtures/pack-job');
  if (!j.ok) throw new Error('fixture invalid');
  return j;
})();

function theme(files: Record<string, string | Buffer>): string {
  const dir = mkdtempSync(join(tmpdir(), 'packsmith-theme-'));
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
  }
  return dir;
}
const render = (dir: string | null) => renderPackFiles(fixture.project, fixture.assessment, OPTS, createEngine({ theme: dir }));

describe('a firm theme', () => {
  it('replaces a partial, the stylesheets, the footer and the logo by name; the rest stays built in', () => {
    const png = Buffer.from('89504e470d0a1a0a', 'hex');
    const dir = theme({
      'partials/signoff.hbs': '<section id="signoff"><h2>Signed for {{firm.name}}</h2></section>',
      'theme.css': '.firm-mark { color: #123456; }',
      'print-footer.hbs': '<div>{{firm.name}} — sheet <span class="pageNumber"></span></div>',
      'logo.png': png,
    });
    const built = render(null);
    const themed = render(dir);
    expect(themed.html).toContain('<h2>Signed for Ampersand &amp; &lt;Sons&gt; Electrical</h2>');
    expect(themed.html).not.toContain('Each person signs for their own part');
    expect(themed.html).toContain('.firm-mark { color: #123456; }');
    expect(themed.footer).toBe('<div>Ampersand &amp; &lt;Sons&gt; Electrical — sheet <span class="pageNumber"></span></div>');
    // (Handlebars writes "=" as &#x3D; in the attribute, which the browser reads back as "=")
    expect(themed.html.replaceAll('&#x3D;', '=')).toContain(`src="data:image/png;base64,${png.toString('base64')}"`);
    // everything the theme does not hold is the built-in file
    expect(themed.header).toBe(built.header);
    const cut = (h: string) => h.slice(h.indexOf('id="summary"'), h.indexOf('id="signoff"'));
    expect(cut(themed.html)).toBe(cut(built.html));
    expect(built.html).toContain('src="data:image/svg+xml;base64,');
  });

  it('may replace pack.css and pack.hbs themselves', () => {
    const dir = theme({ 'pack.css': 'body { color: #010203; }', 'pack.hbs': '<html><style>{{{css}}}</style><body>{{> cover}}</body></html>' });
    const { html } = render(dir);
    expect(html).toContain('body { color: #010203; }');
    expect(html).not.toContain('--st-pass');
    expect(html).toContain('id="cover"');
    expect(html).not.toContain('id="summary"');
  });

  it('is refused when its folder is missing, with the project.yaml position when the job names it', () => {
    expect(() => templateFiles('/nonexistent/theme')).toThrow(/theme folder "\/nonexistent\/theme" not found/);
    const dir = mkdtempSync(join(tmpdir(), 'packsmith-job-'));
    writeFileSync(join(dir, 'project.yaml'), 'title: t\ntheme: ../no-such-theme\n');
    writeFileSync(join(dir, 'circuits.csv'), 'board,ref\n');
    const raw = readJob(dir);
    expect(raw.errors).toContainEqual(expect.objectContaining({ file: 'project.yaml', row: 2, column: 8, message: expect.stringMatching(/^theme: no folder "..\/no-such-theme"/) }));
  });
});

describe('a theme reads only inside its folder', () => {
  // A file outside the theme that a link inside it names: its text must reach neither the pack nor a message.
  const secret = (): string => {
    const path = join(mkdtempSync(join(tmpdir(), 'packsmith-elsewhere-')), 'secret.txt');
    writeFileSync(path, 'TOP-SECRET {{firm.name}}');
    return path;
  };
  const fails = (dir: string, name: string): void => {
    let message = '';
    try {
      render(dir);
    } catch (e) {
      message = e instanceof Error ? e.message : String(e);
    }
    expect(message).toMatch(new RegExp(`theme file .*${name}: a link to a file outside the theme folder`));
    expect(message).not.toContain('TOP-SECRET');
  };
  it('refuses a partial that is a symlink to a file outside the theme', () => {
    const dir = theme({ 'theme.css': '' });
    mkdirSync(join(dir, 'partials'));
    symlinkSync(secret(), join(dir, 'partials', 'signoff.hbs'));
    fails(dir, 'partials/signoff.hbs');
  });
  it('refuses a partials folder that is a symlink to a folder outside the theme', () => {
    const dir = theme({ 'theme.css': '' });
    const elsewhere = mkdtempSync(join(tmpdir(), 'packsmith-elsewhere-'));
    writeFileSync(join(elsewhere, 'signoff.hbs'), 'TOP-SECRET');
    symlinkSync(elsewhere, join(dir, 'partials'));
    fails(dir, 'partials/signoff.hbs');
  });
  it('refuses a logo or stylesheet that is a symlink to a file outside the theme, never embedding it', () => {
    for (const name of ['logo.svg', 'logo.png', 'theme.css', 'pack.hbs']) {
      const dir = theme({});
      symlinkSync(secret(), join(dir, name));
      fails(dir, name);
    }
  });
  it('follows a symlink that stays inside the theme', () => {
    const dir = theme({ 'firm.css': '.inside-link { color: #0a0b0c; }' });
    symlinkSync(join(dir, 'firm.css'), join(dir, 'theme.css'));
    expect(render(dir).html).toContain('.inside-link { color: #0a0b0c; }');
  });
});

describe('templates fail loudly', () => {
  it('a misspelled field is an error naming the template file', () => {
    const dir = theme({ 'partials/cover.hbs': '<section id="cover">{{clent.name}}</section>' });
    expect(() => render(dir)).toThrow(TemplateError);
    expect(() => render(dir)).toThrow(/partials\/cover\.hbs: the template reads "clent", which view does not have \(it has: title, job, client,/);
  });

  it('so is a misspelled field given to a helper or a partial, which strict mode alone lets through', () => {
    for (const [body, field] of [
      ['{{#if clent}}x{{/if}}', 'clent'],
      ['{{#each bords}}x{{/each}}', 'bords'],
      ['{{num supply.ze}}', 'ze'],
      ['{{> status look=overal}}', 'overal'],
      ['{{#each boards}}{{#each circuits}}{{num derived.iz}}{{/each}}{{/each}}', 'iz'],
    ] as const) {
      const dir = theme({ 'partials/notes.hbs': body });
      expect(() => render(dir), body).toThrow(new RegExp(`partials/notes\\.hbs: the template reads "${field}"`));
    }
  });

  it('a template that does not parse, or a missing partial, is an error too', () => {
    expect(() => render(theme({ 'partials/rules.hbs': '{{#if rules}}unclosed' }))).toThrow(/partials\/rules\.hbs: Parse error/);
    expect(() => render(theme({ 'partials/rules.hbs': '{{> no-such-partial}}' }))).toThrow(/The partial no-such-partial could not be found/);
  });

  it('the built-in templates render every demo job', () => {
    for (const dir of ['projects/tannery-row-refit', 'projects/marsh-street-surgery']) {
      const j = loadJob(dir);
      if (!j.ok) throw new Error(`${dir} invalid`);
      const themeDir = j.project.file.theme ? join(dir, j.project.file.theme) : null;
      expect(renderPack(j.project, j.assessment, OPTS, createEngine({ theme: themeDir }))).toMatch(/<\/html>\s*$/);
    }
  });
});
