// Verdicts are visible without colour: a word, a symbol and a shape for each status, and colours
// that read on paper.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { STATUS_LOOK } from '../../src/render/view.js';
import { createEngine } from '../../src/render/engine.js';
import { STATUSES } from '../../src/calc/types.js';

/** WCAG 2.1 relative luminance of an sRGB colour (definition under SC 1.4.3). */
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
}
/** WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05). */
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi! + 0.05) / (lo! + 0.05);
}
function palette(file: string): Record<string, string> {
  const css = readFileSync(file, 'utf8');
  return Object.fromEntries([...css.matchAll(/--([\w-]+):\s*(#[0-9a-fA-F]{6})\b/g)].map((m) => [m[1]!, m[2]!.toLowerCase()]));
}

describe('status looks', () => {
  it('give every status its own word, symbol, shape and class', () => {
    for (const key of ['word', 'symbol', 'shape', 'css'] as const) {
      expect(new Set(STATUSES.map((s) => STATUS_LOOK[s][key])).size, key).toBe(STATUSES.length);
    }
  });

  it('draw the shape and the symbol beside the word, each status differently', () => {
    // a theme whose pack.hbs draws the built-in status partial once per status
    const dir = mkdtempSync(join(tmpdir(), 'packsmith-status-'));
    writeFileSync(join(dir, 'pack.hbs'), '{{#each looks}}{{> status look=this}}@@{{/each}}');
    const lines = createEngine({ theme: dir }).render('pack.hbs', { looks: STATUSES.map((s) => ({ status: s, ...STATUS_LOOK[s] })) }).split('@@').slice(0, -1).map((l) => l.trim());
    lines.forEach((l, i) => {
      const look = STATUS_LOOK[STATUSES[i]!];
      expect(l).toBe(`<span class="status ${look.css}"><span class="sym sh-${look.shape}" aria-hidden="true">${look.symbol}</span> ${look.word}</span>`);
    });
    // pack.css draws each shape differently (the browser test checks what it really draws)
    const css = readFileSync('templates/pack.css', 'utf8');
    const rules = STATUSES.map((s) => STATUS_LOOK[s].shape).filter((sh) => sh !== 'none')
      .map((sh) => [...css.matchAll(new RegExp(`\\.sym\\.sh-${sh}[^{]*\\{([^}]*)\\}`, 'g'))].map((m) => m[1]!.trim()).join(' '));
    expect(rules.every((r) => r.length > 0)).toBe(true);
    expect(new Set(rules).size).toBe(rules.length);
  });

  // WCAG 2.1 SC 1.4.3: text contrast at least 4.5:1 (the status word is normal-size text)
  for (const file of ['templates/pack.css', 'themes/fenwick-lane/theme.css']) {
    it(`${file}: each status colour reads at 4.5:1 or more on the page and on table headings`, () => {
      const p = palette(file);
      for (const s of ['pass', 'fail', 'attention', 'open', 'na']) {
        const colour = p[`st-${s}`];
        expect(colour, `--st-${s}`).toBeDefined();
        expect(contrast(colour!, '#ffffff'), `--st-${s} on white`).toBeGreaterThanOrEqual(4.5);
        expect(contrast(colour!, p.band ?? '#ffffff'), `--st-${s} on --band`).toBeGreaterThanOrEqual(4.5);
      }
      // the fail symbol is white on a filled square of the fail colour
      expect(contrast(p['st-fail']!, '#ffffff')).toBeGreaterThanOrEqual(4.5);
    });
  }

  it('computes contrast as WCAG does', () => {
    // WCAG 2.1 definitions: black on white is 21:1, a colour on itself 1:1
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 5);
    expect(contrast('#777777', '#777777')).toBe(1);
    // #767676 on white is the lightest grey meeting 4.5:1 (common practice)
    expect(contrast('#767676', '#ffffff')).toBeGreaterThanOrEqual(4.5);
    expect(contrast('#777777', '#ffffff')).toBeLessThan(4.5);
  });
});
