import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { markdownToHtml, pipelineHtml } from '../../src/render/markdown.js';
import { plainNotesHtml } from '../../src/render/markdown-plain.js';

describe('notes.md to safe HTML', () => {
  it('renders Markdown with tables', () => {
    const html = markdownToHtml('## Scope\n\n| a | b |\n| - | - |\n| 1 | 2 |\n');
    expect(html).toContain('<h2>Scope</h2>');
    expect(html).toContain('<td>1</td>');
  });
  it('drops scripts, event handlers, styles and remote resources', () => {
    const html = markdownToHtml([
      '<script>alert(1)</script>',
      '<img src="https://tracker.example/p.gif" onerror="alert(2)">',
      '![photo](https://tracker.example/photo.jpg)',
      '<a href="javascript:alert(3)" onclick="alert(4)">x</a>',
      '<iframe src="https://example.com"></iframe>',
      '<p style="background:url(https://tracker.example/bg.png)">styled</p>',
    ].join('\n\n'));
    expect(html).not.toMatch(/<script|onerror|onclick|javascript:|<img|<iframe|style=|https:\/\/tracker/);
  });
});

describe('notes of only headings and plain paragraphs', () => {
  // mulberry32: the same notes on every run
  let seed = 29;
  const next = (n: number) => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) % n;
  };
  const pick = <T>(xs: readonly T[]): T => xs[next(xs.length)]!;
  const WORDS = ['Scope', 'the', 'board', 'DB1', '32', 'A', 'circuit', 'kiln', "client's", '"quoted"', '(ring)', 'Zs', '0.84', 'Ω', 'mm²', '—', '≤', 'été', 'Ärger', '日本',
    'a,', 'b.', 'c;', 'd:', 'e?', 'f!', '50%', '+5', 'x-y', '1.', '2)', '°C', '±1', '3×4', 'a·b', '‘a’', '“b”'];
  // anything Markdown may read otherwise: each must send the notes to the full pipeline, or give the same HTML there
  const ODD = ['*a*', '_a_', '`a`', '[a](b)', '<b>', '<', '>', '1<2', 'a & b', '&amp;', 'a\\b', 'a | b', '~~a~~', 'a=b', 'a/b', 'a@b.c', 'www.x.org', 'WwW.x', 'http://x', 'https://x.y',
    '#', 'C#', '![a](b)', '[^1]', '\t', '\r', '\u00a0', '\u0000', '\u200b', '😀', 'é', 'x\u0301', '\ufeff', '$x$', '{a}', '<!-- c -->', '::', 'a  b'];
  const LETTER_WORDS = WORDS.filter((w) => /^\p{L}/u.test(w));
  const text = () => [pick(LETTER_WORDS), ...Array.from({ length: next(6) }, () => pick(WORDS))].join(' ');
  /** Lines Markdown reads as something else than a heading or a line of a paragraph, or that may change one. */
  const oddLine = (): string => {
    switch (next(6)) {
      case 0: return pick(['===', '---', '***', '___', '- - -', '=', '-', '```', '~~~', '<div>', '</div>', '<!--', '-->', '[a]: http://x', '| a | b |', '|---|---|', ' ', '\t', '\r']);
      case 1: return `${pick(['- ', '* ', '+ ', '1. ', '2) ', '> ', '    ', ' ', '   ', '| ', '\t'])}${text()}`;
      case 2: return `${text()}${pick(['  ', ' ', '\\', '\t', ' |', '\r'])}`;
      case 3: return `${pick(['', '#######', '#', '##'])}${pick(['', '  ', '\t', ' '])}${text()}${pick(['', ' #', ' ##', '#'])}`;
      case 4: return `${'#'.repeat(1 + next(6))} ${pick(['#', '', ' ', '(', '"', '1. ', '- ', '—'])}${text()}`;
      default: return `${pick(['', ' ', '\u00a0'])}${pick(WORDS)}`;
    }
  };
  /** Notes in the plain shape: blank lines, headings and lines of paragraphs. */
  const plainLines = (): string[] => Array.from({ length: 1 + next(9) }, () => {
    const k = next(6);
    return k === 0 ? '' : k === 1 ? `${'#'.repeat(1 + next(6))} ${pick([...LETTER_WORDS, '1.', '32', 'Ω'])}${next(2) ? ` ${text()}` : ''}` : text();
  });
  const notes: string[] = ['## Scope\n\nGenerated job 1 for the bench: 24 circuits on 1 board(s).\n', '', '\n\n', '# A\n## B\n### C\n#### D\n##### E\n###### F', 'a\n\n\n\nb',
    '####### Seven', '#Scope', '# #', '## Scope #', '# Scope\n===', 'Scope\n===', 'Scope\n---', 'See www.example.com', 'WWW.example.com', 'a\tb', '  Indented', '    Code',
    'Trailing  \nbreak', 'Back\\\nslash', 'x\r\ny', '\ufeffBOM', 'a\u00a0b', 'a`b`', 'a\u0000b', 'Scope\n- item', 'Scope\n1. item', 'Scope\n> quote', 'a | b\n--|--', 'Zs = 0.8 Ω'];
  for (let i = 0; i < 1500; i++) {
    const lines = plainLines();
    // a third plain; the others with one thing Markdown may read otherwise (a few with two)
    for (let n = next(3) === 0 ? 0 : next(5) === 0 ? 2 : 1; n > 0; n--) {
      const at = next(lines.length + 1);
      if (next(2)) {
        lines.splice(at, 0, oddLine());
      } else {
        const words = (lines[at] ?? text()).split(' ');
        words.splice(next(words.length + 1), 0, pick(ODD));
        lines[at] = words.join(next(5) === 0 ? '' : ' ');
      }
    }
    notes.push(lines.join('\n') + pick(['', '\n', '\n\n']));
  }
  for (const root of ['projects', 'tests/fixtures']) {
    for (const job of readdirSync(root)) {
      const f = join(root, job, 'notes.md');
      if (existsSync(f)) notes.push(readFileSync(f, 'utf8'));
    }
  }

  it('give the HTML of the full pipeline, for notes in that shape and out of it, at any heading level', () => {
    let plain = 0;
    for (const [i, md] of notes.entries()) {
      for (const level of i % 5 === 0 ? [0, 1, 3, 6] : [0, 3]) {
        const fast = plainNotesHtml(md, level);
        if (fast === null) continue;
        plain++;
        expect(fast, JSON.stringify(md)).toBe(pipelineHtml(md, level));
      }
      expect(markdownToHtml(md, { topLevel: 3 }), JSON.stringify(md)).toBe(pipelineHtml(md, 3));
    }
    // both paths are taken, often
    expect(plain).toBeGreaterThan(1000);
    expect(notes.filter((md) => plainNotesHtml(md, 3) === null).length).toBeGreaterThan(500);
  });
});
