// The progress line: on a terminal, for more than a few jobs; silent otherwise.
import { describe, expect, it } from 'vitest';
import { progressLine, PROGRESS_ABOVE } from '../../src/print/progress.js';

const stream = (isTTY: boolean) => {
  const out: string[] = [];
  return { out, s: { isTTY, columns: 60, write: (c: string) => out.push(c) } };
};

describe('the progress line', () => {
  it('counts packs in place on a terminal and clears itself at the end', () => {
    const { out, s } = stream(true);
    const p = progressLine(8, s);
    for (let i = 0; i < 8; i++) p.tick(`job-${i}`);
    p.done();
    expect(out[0]).toBe('\r\x1b[2Kpacksmith: 1/8 packs (12 %) job-0');
    expect(out[7]).toBe('\r\x1b[2Kpacksmith: 8/8 packs (100 %) job-7');
    expect(out[8]).toBe('\r\x1b[2K');
    expect(out.every((l) => !l.includes('\n'))).toBe(true);
  });

  it('keeps within the terminal width', () => {
    const { out, s } = stream(true);
    progressLine(10, s).tick('a-very-long-job-folder-name-that-would-wrap-the-terminal-line');
    expect(out[0]!.length - '\r\x1b[2K'.length).toBeLessThanOrEqual(59);
  });

  it('is silent when not a terminal, or for a few jobs', () => {
    for (const [tty, n] of [[false, 200], [true, PROGRESS_ABOVE]] as const) {
      const { out, s } = stream(tty);
      const p = progressLine(n, s);
      for (let i = 0; i < n; i++) p.tick();
      p.done();
      expect(out).toEqual([]);
    }
  });
});
