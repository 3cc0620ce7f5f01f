import fc from 'fast-check';
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
  const WORDS = ['Scope', 'the', 'board', 'DB1', '32', 'A', 'circuit', 'kiln', "client's", '"quoted"', '(ring)', 'Zs', '0.84', 'Ω', 'mm²', '—', '≤', 'été', 'Ärger', '日本',
    'a,', 'b.', 'c;', 'd:', 'e?', 'f!', '50%', '+5', 'x-y', '1.', '2)', '°C', '±1', '3×4', 'a·b', '‘a’', '“b”'];
  const LETTER_WORDS = WORDS.filter((w) => /^\p{L}/u.test(w));
  // anything Markdown may read otherwise: each must send the notes to the full pipeline, or give the same HTML there
  const ODD = ['*a*', '_a_', '`a`', '[a](b)', '<b>', '<', '>', '1<2', 'a & b', '&amp;', 'a\\b', 'a | b', '~~a~~', 'a=b', 'a/b', 'a@b.c', 'www.x.org', 'WwW.x', 'http://x', 'https://x.y',
    '#', 'C#', '![a](b)', '[^1]', '\t', '\r', '\u00a0', '\u0000', '\u200b', '😀', 'é', 'x\u0301', '\ufeff', '$x$', '{a}', '<!-- c -->', '::', 'a  b'];

  const word = fc.constantFrom(...WORDS);
  const line = fc.tuple(fc.constantFrom(...LETTER_WORDS), fc.array(word, { maxLength: 6 })).map(([first, rest]) => [first, ...rest].join(' '));
  const heading = fc.tuple(fc.integer({ min: 1, max: 6 }), fc.constantFrom(...LETTER_WORDS, '1.', '32', 'Ω'), fc.option(line))
    .map(([depth, first, rest]) => `${'#'.repeat(depth)} ${first}${rest === null ? '' : ` ${rest}`}`);
  /** Lines of notes in the plain shape: blank, a heading, a line of a paragraph. */
  const plainLine = fc.oneof(fc.constant(''), heading, line, line);
  /** Lines Markdown reads as something else than a heading or a line of a paragraph, or that may change one. */
  const oddLine = fc.oneof(
    fc.constantFrom('===', '---', '***', '___', '- - -', '=', '-', '```', '~~~', '<div>', '</div>', '<!--', '-->', '[a]: http://x', '| a | b |', '|---|---|', ' ', '\t', '\r'),
    fc.tuple(fc.constantFrom('- ', '* ', '+ ', '1. ', '2) ', '> ', '    ', ' ', '   ', '| ', '\t'), line).map(([a, b]) => a + b),
    fc.tuple(line, fc.constantFrom('  ', ' ', '\\', '\t', ' |', '\r')).map(([a, b]) => a + b),
    fc.tuple(fc.constantFrom('', '#######', '#', '##'), fc.constantFrom('', '  ', '\t', ' '), line, fc.constantFrom('', ' #', ' ##', '#')).map((p) => p.join('')),
    fc.tuple(fc.integer({ min: 1, max: 6 }), fc.constantFrom('#', '', ' ', '(', '"', '1. ', '- ', '—'), line).map(([depth, a, b]) => `${'#'.repeat(depth)} ${a}${b}`),
    fc.tuple(fc.constantFrom('', ' ', '\u00a0'), word).map(([a, b]) => a + b),
    // an odd piece among plain words, after a space or straight after a word
    fc.tuple(fc.array(word, { maxLength: 3 }), fc.constantFrom(...ODD), fc.array(word, { maxLength: 3 }), fc.constantFrom(' ', ''), fc.constantFrom(...LETTER_WORDS))
      .map(([before, odd, after, space, first]) => [first, ...before, odd, ...after].join(space)),
  );
  const notes = fc.tuple(fc.array(plainLine, { minLength: 1, maxLength: 9 }), fc.array(fc.tuple(fc.nat(), oddLine), { maxLength: 2 }), fc.constantFrom('', '\n', '\n\n'))
    .map(([lines, odd, end]) => {
      const all = [...lines];
      for (const [at, l] of odd) all.splice(at % (all.length + 1), 0, l);
      return all.join('\n') + end;
    });

  const AWKWARD = ['## Scope\n\nGenerated job 1 for the bench: 24 circuits on 1 board(s).\n', '', '\n\n', '# A\n## B\n### C\n#### D\n##### E\n###### F', 'a\n\n\n\nb',
    '####### Seven', '#Scope', '# #', '## Scope #', '# Scope\n===', 'Scope\n===', 'Scope\n---', 'See www.example.com', 'WWW.example.com', 'a\tb', '  Indented', '    Code',
    'Trailing  \nbreak', 'Back\\\nslash', 'x\r\ny', '\ufeffBOM', 'a\u00a0b', 'a`b`', 'a\u0000b', 'Scope\n- item', 'Scope\n1. item', 'Scope\n> quote', 'a | b\n--|--', 'Zs = 0.8 Ω', 'a < b'];

  it('give the HTML of the full pipeline, for notes in that shape and out of it, at any heading level', () => {
    const seen = { plain: 0, other: 0 };
    const same = (md: string, level: number) => {
      const fast = plainNotesHtml(md, level);
      seen[fast === null ? 'other' : 'plain']++;
      if (fast !== null) expect(fast, JSON.stringify(md)).toBe(pipelineHtml(md, level));
    };
    const demo = ['projects', 'tests/fixtures'].flatMap((root) => readdirSync(root).map((job) => join(root, job, 'notes.md')).filter(existsSync)).map((f) => readFileSync(f, 'utf8'));
    for (const md of [...AWKWARD, ...demo]) {
      for (const level of [0, 1, 3, 6, -2, 9]) same(md, level);
      expect(plainNotesHtml(md, 2.5)).toBeNull();
      expect(markdownToHtml(md, { topLevel: 3 }), JSON.stringify(md)).toBe(pipelineHtml(md, 3));
    }
    fc.assert(fc.property(notes, fc.constantFrom(0, 1, 3, 6), (md, level) => same(md, level)), { numRuns: 2500 });
    // both paths are taken, often
    expect(seen.plain).toBeGreaterThan(500);
    expect(seen.other).toBeGreaterThan(500);
  });
});
