// The policy put into a page template once (csp.ts cspInTemplate) gives the bytes `withCsp` gives
// each rendered page, whatever the theme's pack.hbs looks like; where it cannot go into the
// template, each page goes through withCsp.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createEngine } from '../../src/render/engine.js';
import { CSP_META, cspInTemplate, withCsp } from '../../src/render/csp.js';

const VIEW = { title: 'A <b> & "c"', draft: true, items: ['x', 'y'] };

const PAGES: [string, string][] = [
  ['a head before any mustache', '<!doctype html>\n<html lang="en">\n<head>\n<title>{{title}}</title></head><body>{{#each items}}{{this}}{{/each}}</body></html>\n'],
  ['a head with attributes', '<html><HEAD data-x="1">\n  {{#if draft}}\n<title>{{title}}</title>\n  {{/if}}\n</HEAD></html>'],
  ['whitespace control right after the head', '<html><head>   \n  {{~title~}}  </head></html>'],
  ['a block on the head\'s own line', '<html><head>{{#if draft}}\n<title>x</title>\n{{/if}}\n</head></html>'],
  ['a head after a mustache', '{{!-- a comment first --}}<html><head><title>{{title}}</title></head></html>'],
  ['a head inside a mustache\'s output only', '<html>{{title}}<head></head></html>'],
  ['no head', '<html><body>{{title}}</body></html>'],
  ['a mustache inside the head tag', '<html><head data-t="{{title}}"><title></title></head></html>'],
];

describe('the Content-Security-Policy in a page template', () => {
  for (const [what, source] of PAGES) {
    it(`gives what withCsp gives: ${what}`, () => {
      const dir = mkdtempSync(join(tmpdir(), 'packsmith-csp-'));
      writeFileSync(join(dir, 'pack.hbs'), source);
      const engine = createEngine({ theme: dir });
      const page = engine.renderPage('pack.hbs', VIEW);
      expect(page).toBe(withCsp(engine.render('pack.hbs', VIEW)));
      expect(page).toContain(CSP_META);
    });
  }

  it('goes into the template only where the <head> comes before any "{{"', () => {
    expect(cspInTemplate('<html><head><title>{{t}}</title>')).toBe(`<html><head>\n${CSP_META}<title>{{t}}</title>`);
    expect(cspInTemplate('{{t}}<head>')).toBeNull();
    expect(cspInTemplate('<head data-x="{{t}}">')).toBeNull();
    expect(cspInTemplate('<html><body></body></html>')).toBeNull();
  });
});
