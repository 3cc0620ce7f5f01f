// Two prints of one pack must give the same bytes (the archive's promise). Chromium sometimes snaps
// a text baseline that a `vertical-align` length moved by a fraction of a CSS pixel to the pixel,
// and sometimes leaves it where layout put it: a superscript raised by 0.4em printed at y 2718 in
// one run and 2718.5469 in another. So the stylesheets shift baselines only by whole pixels or by
// keywords that keep the baseline where the line puts it.
import { readFileSync, readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

const SAFE_KEYWORDS = new Set(['baseline', 'top', 'bottom', 'middle', 'text-top', 'text-bottom', 'inherit', 'initial', 'unset']);

/** The values of every `vertical-align` declaration in a stylesheet. */
export function verticalShifts(css: string): string[] {
  const text = css.replace(/\/\*[\s\S]*?\*\//g, '');
  return [...text.matchAll(/vertical-align\s*:\s*([^;}]+)/g)].map((m) => m[1]!.trim());
}

/** A shift that lands a baseline on the pixel the line's baseline is on. */
export const wholePixelShift = (value: string): boolean => SAFE_KEYWORDS.has(value) || /^-?\d+px$/.test(value) || value === '0';

describe('baseline shifts in the stylesheets', () => {
  it('tells a whole-pixel shift from one that can fall between pixels', () => {
    expect(verticalShifts('a { vertical-align: 0.4em; } /* vertical-align: 2em */ b{vertical-align:3px}')).toEqual(['0.4em', '3px']);
    expect(['3px', '-1px', 'top', 'baseline', '0'].every(wholePixelShift)).toBe(true);
    expect(['0.4em', '1.5px', '10%', 'super', 'sub', '0.1em'].some(wholePixelShift)).toBe(false);
  });

  const sheets = ['templates', ...readdirSync('themes').map((t) => `themes/${t}`)].flatMap((dir) =>
    readdirSync(dir).filter((f) => f.endsWith('.css')).map((f) => `${dir}/${f}`));
  it('finds the built-in stylesheet among those it checks', () => expect(sheets).toContain('templates/pack.css'));
  for (const file of sheets) {
    it(`${file} moves baselines only by whole pixels`, () => {
      const shifts = verticalShifts(readFileSync(file, 'utf8'));
      expect(shifts.filter((v) => !wholePixelShift(v))).toEqual([]);
    });
  }
});
