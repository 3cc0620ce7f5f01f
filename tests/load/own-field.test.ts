// A record built from names a file gives keeps "__proto__" as an own field, as Object.fromEntries does
// (ECMA-262 CreateDataProperty), never as its prototype.
import { describe, expect, it } from 'vitest';
import { setOwn } from '../../src/load/own-field.js';
import { readCsv } from '../../src/load/csv.js';

describe('setOwn', () => {
  it('makes "__proto__" an own field and leaves the prototype alone, as Object.fromEntries does', () => {
    const cell = { text: '32' };
    const out: Record<string, unknown> = {};
    setOwn(out, 'rating_a', '16');
    setOwn(out, '__proto__', cell);
    const reference = Object.fromEntries([['rating_a', '16'], ['__proto__', cell]]);
    expect(Object.getPrototypeOf(out)).toBe(Object.prototype);
    expect(Object.keys(out)).toEqual(Object.keys(reference));
    expect(Object.getOwnPropertyDescriptor(out, '__proto__')).toEqual(Object.getOwnPropertyDescriptor(reference, '__proto__'));
    expect((out as { text?: unknown }).text).toBeUndefined(); // the cell did not become the prototype
  });
});

describe('a CSV header "__proto__"', () => {
  it('is a column of its own: its cell an own field of the row, lending no fields to the others', () => {
    const { table, errors } = readCsv('readings/2026-11-16.csv', 'board,ref,__proto__,text\nDB1,1,0.21,\n');
    expect(errors).toEqual([]);
    const cells = table.rows[0]!.cells;
    expect(Object.getPrototypeOf(cells)).toBe(Object.prototype);
    expect(Object.keys(cells)).toEqual(['board', 'ref', '__proto__']);
    expect(cells['__proto__']).toEqual({ text: '0.21', column: 3 });
    expect(cells['text']).toBeUndefined(); // the empty cell stays empty
  });
});
