import { describe, expect, it } from 'vitest';
import { markdownToHtml } from '../../src/render/markdown.js';

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
