// The CSV reader parses a file's header and its rows apart (src/load/csv.ts, parseRecords), so that
// csv-parse builds no error object for every row whose length differs from the header's. Whatever
// the text, that must give exactly what one parse of the whole file gives: the same records, each
// ending on the same line, and the same error where csv-parse refuses the text. A plain file is
// read without csv-parse (plainRecords): where it reads a file, it must give what csv-parse gives.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parse } from 'csv-parse/sync';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { CSV_OPTIONS, parseRecords, plainRecords, separatorOf } from '../../src/load/csv.js';

type Outcome = { records: { record: string[]; lines: number }[] } | { error: string };

function outcome(read: () => { record: string[]; info: { lines: number } }[]): Outcome {
  try {
    return { records: read().map((r) => ({ record: r.record, lines: r.info.lines })) };
  } catch (err) {
    return { error: (err as Error).message };
  }
}

const whole = (text: string) => outcome(() => parse(text, { ...CSV_OPTIONS, delimiter: separatorOf(text) }) as unknown as { record: string[]; info: { lines: number } }[]);
const apart = (text: string) => outcome(() => parseRecords(text, separatorOf(text)));

// cells, separators, quotes and every line ending, a byte-order mark and blank lines
const piece = fc.constantFrom('a', 'b1', '', ' ', ',', ',', ';', '\t', '"', '""', '"x,y"', '"two\nlines"', '\n', '\n', '\r\n', '\r', 'é', '\uFEFF');
const text = fc.tuple(fc.boolean(), fc.array(piece, { maxLength: 40 })).map(([bom, parts]) => (bom ? '\uFEFF' : '') + parts.join(''));
const eol = fc.constantFrom('\n', '\r\n', '\r');
const table = fc.tuple(eol, fc.constantFrom(',', ';'), fc.integer({ min: 1, max: 4 }), fc.array(fc.tuple(fc.integer({ min: 0, max: 6 }), fc.constantFrom('x', '', '"q"', '"a,b"', '"open', '"multi\nline"')), { maxLength: 8 }), fc.boolean())
  .map(([end, sep, cols, rows, last]) => [Array.from({ length: cols }, (_, i) => `h${i}`).join(sep), ...rows.map(([n, cell]) => Array(n).fill(cell).join(sep))].join(end) + (last ? end : ''));

describe('the CSV records, header and rows parsed apart', () => {
  it('are those of one parse of the whole file, lines and errors included, for any text', () => {
    fc.assert(fc.property(text, (t) => { expect(apart(t)).toEqual(whole(t)); }), { numRuns: 1000 });
  });
  it('are those of one parse of the whole file for tables with rows of any length and any line ending', () => {
    fc.assert(fc.property(table, (t) => { expect(apart(t)).toEqual(whole(t)); }), { numRuns: 1000 });
  });
  it('end on the lines of the file: a header after blank lines, and rows after a Windows line ending', () => {
    const r = parseRecords('\r\n\r\nboard,ref\r\nDB1,1\r\n\r\nDB1,2,x\r\n', ',');
    expect(r.map((x) => [x.record, x.info.lines])).toEqual([[['board', 'ref'], 3], [['DB1', '1'], 4], [['DB1', '2', 'x'], 6]]);
  });
});

// the pieces above, and what the plain reader must turn down: NUL, lone surrogates (csv-parse reads
// UTF-8 bytes, where a lone surrogate is U+FFFD), quotes out of place, mixed line endings
const awkward = fc.constantFrom('a', '', ' ', ',', ',', ';', '\t', '"', '""', '"x,y"', '"a""b"', '"two\nlines"', '"\r\n"', ' "', '" ', 'x"y',
  '\n', '\n', '\r\n', '\r\n', '\r', 'é', '\uFEFF', '\0', '\ud800', '\udc00', '😀', '\u2028');
const awkwardText = fc.tuple(fc.boolean(), fc.array(awkward, { maxLength: 40 })).map(([bom, parts]) => (bom ? '\uFEFF' : '') + parts.join(''));
const cell = fc.constantFrom('x', '', ' ', '"q"', '"a,b"', '""', '"a""b"', '" "', 'é😀', '"open', '"multi\nline"', 'a"b', '"a" ');
const quotedTable = fc.tuple(fc.constantFrom('\n', '\r\n'), fc.constantFrom(',', ';', '\t'), fc.integer({ min: 1, max: 4 }), fc.array(fc.tuple(fc.integer({ min: 0, max: 6 }), cell), { maxLength: 8 }), fc.boolean(), fc.boolean())
  .map(([end, sep, cols, rows, last, quoted]) => [Array.from({ length: cols }, (_, i) => (quoted ? `"h${i}"` : `h${i}`)).join(sep), ...rows.map(([n, c]) => Array(n).fill(c).join(sep))].join(end) + (last ? end : ''));

/** What the plain reader gives, where it reads the text; null where it leaves it to csv-parse. */
const plain = (text: string): Outcome | null => {
  const r = plainRecords(text, separatorOf(text));
  return r === null ? null : outcome(() => r);
};

describe('the plain CSV reader', () => {
  it('gives what one parse of the whole file gives, wherever it reads a file itself, and no cell over two lines', () => {
    let read = 0;
    for (const arb of [text, awkwardText, table, quotedTable]) {
      fc.assert(fc.property(arb, (t) => {
        const p = plain(t);
        if (p === null) return;
        read += 1;
        expect(p).toEqual(whole(t));
        // readCsv takes each record's line as it stands and looks for no cell over lines
        if ('records' in p) expect(p.records.flatMap((r) => r.record).filter((c) => /[\r\n]/.test(c))).toEqual([]);
      }), { numRuns: 2000 });
    }
    expect(read).toBeGreaterThan(1000); // many of the texts are plain enough for it
  });
  it('reads the files of the demo jobs and the fixtures itself', () => {
    const root = fileURLToPath(new URL('../../', import.meta.url));
    const files = ['projects', 'tests/fixtures'].flatMap((top) => readdirSync(join(root, top)).flatMap((job) => {
      const dir = join(root, top, job);
      const readings = (() => { try { return readdirSync(join(dir, 'readings')).map((n) => join(dir, 'readings', n)); } catch { return []; } })();
      return [join(dir, 'circuits.csv'), ...readings].filter((f) => f.endsWith('.csv') && (() => { try { readFileSync(f); return true; } catch { return false; } })());
    }));
    expect(files.length).toBeGreaterThan(10);
    const broken = fileURLToPath(new URL('../fixtures/broken-job/circuits.csv', import.meta.url)); // a stray quote: csv-parse's to report
    for (const f of files) {
      const t = readFileSync(f, 'utf8');
      if (f === broken) continue;
      expect(plain(t), f).toEqual(whole(t));
    }
  });
  it('leaves to csv-parse a quote out of place, a cell over two lines, mixed line endings, NUL and lone surrogates', () => {
    for (const t of ['a,b\nx"y,1\n', 'a,b\n"x"y,1\n', 'a,b\n"x\ny",1\n', 'a,b\r\nx,1\ny,2\n', 'a,b\nx,1\ry,2', 'a,b\nx,\0\n', 'a,b\nx,\ud800\n', 'a,b\n"open,1\n']) {
      expect(plainRecords(t, ','), JSON.stringify(t)).toBeNull();
    }
  });
});

describe('the separator of a file', () => {
  // separatorOf finds the first line that is not blank without splitting the whole file
  const reference = (t: string): string => {
    const head = t.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/).find((l) => l.trim() !== '') ?? '';
    return head.includes(',') ? ',' : head.includes(';') ? ';' : head.includes('\t') ? '\t' : ',';
  };
  it('is read from the first line that is not blank, as splitting the file at every line ending finds it', () => {
    const piece = fc.constantFrom('a', ' ', '\t', ',', ';', '\n', '\r', '\r\n', '\uFEFF', '\u00a0', '\u2028', '"');
    fc.assert(fc.property(fc.array(piece, { maxLength: 30 }).map((p) => p.join('')), (t) => { expect(separatorOf(t)).toBe(reference(t)); }), { numRuns: 5000 });
  });
});
