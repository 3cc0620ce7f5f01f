// The CSV reader parses a file's header and its rows apart (src/load/csv.ts, parseRecords), so that
// csv-parse builds no error object for every row whose length differs from the header's. Whatever
// the text, that must give exactly what one parse of the whole file gives: the same records, each
// ending on the same line, and the same error where csv-parse refuses the text.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parse } from 'csv-parse/sync';
import { CSV_OPTIONS, parseRecords, separatorOf } from '../../src/load/csv.js';

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
