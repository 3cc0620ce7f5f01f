// mapColumns (src/model/columns.ts) uses a table's rows as they are where every column keeps its
// header (nothing renamed, ignored or given twice), instead of rebuilding each row's cells. Whatever
// the headers, the mapping and the rows, the rows it gives must be those of rebuilding every row:
// each own cell under its new name, in the row's key order, on a plain object.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readCsv } from '../../src/load/csv.js';
import type { RawTable } from '../../src/load/raw.js';
import { mapColumns } from '../../src/model/columns.js';
import { CIRCUIT_COLUMNS } from '../../src/model/schema.js';

/** Every row rebuilt, as mapColumns did for every table: cells renamed by the header it gives back. */
function rebuilt(table: RawTable, mapped: RawTable): RawTable['rows'] {
  const renamed = new Map<string, string>();
  for (const h of table.header) {
    const to = mapped.header.find((m) => m.column === h.column);
    if (to) renamed.set(h.text, to.text);
  }
  return table.rows.map((r) => ({
    row: r.row,
    cells: Object.fromEntries(Object.entries(r.cells).flatMap(([name, cell]) => {
      const to = renamed.get(name);
      return to === undefined ? [] : [[to, cell] as const];
    })),
  }));
}

/** A row as validation sees it: its line, whether its cells are a plain object, its own cells in order, and what a lookup of any name finds. */
const seen = (rows: RawTable['rows'], names: string[]) => rows.map((r) => ({
  row: r.row,
  plain: Object.getPrototypeOf(r.cells) === Object.prototype,
  own: Object.entries(r.cells),
  found: names.map((n) => (r.cells as Record<string, unknown>)[n]),
}));

const HEADERS = ['board', 'ref', 'zs_ohm', 'Zs (Ω)', 'r1r2_ohm', 'Tester', 'tested_by', 'notes', 'Serial', '__proto__', 'constructor', 'text', 'column', '', 'description', 'rating_a'];
const MAPPINGS: Record<string, string>[] = [
  {}, { 'Zs (Ω)': 'zs_ohm' }, { Tester: 'tested_by' }, { Serial: 'ignore' }, { zs_ohm: 'ignore' }, { notes: 'ignore', Tester: 'notes' },
  { board: 'ref' }, { 'Zs (Ω)': 'zs_ohm', Serial: 'ignore', Tester: 'tested_by' }, Object.fromEntries([['__proto__', 'notes']]) as Record<string, string>, { description: 'notes' },
];
const value = fc.constantFrom('', ' ', 'DB1', '1', '0.5', 'x', '"a,b"');
const csv = fc.tuple(fc.array(fc.constantFrom(...HEADERS), { minLength: 1, maxLength: 7 }), fc.array(fc.array(value, { minLength: 1, maxLength: 8 }), { maxLength: 6 }))
  .map(([head, rows]) => [head.join(','), ...rows.map((r) => r.join(','))].join('\n'));

describe('the rows of a table whose columns keep their headers', () => {
  it('are those of rebuilding every row, for readings and circuits, with any headers and mapping', () => {
    let asIs = 0;
    fc.assert(fc.property(csv, fc.constantFrom(...MAPPINGS), fc.boolean(), (text, columns, circuits) => {
      const { table } = readCsv('readings/2026-01-01.csv', text);
      const mapped = circuits ? mapColumns(table, columns, CIRCUIT_COLUMNS, {}) : mapColumns(table, columns);
      const names = [...HEADERS, 'tested_by', 'text', 'column', 'toString'];
      expect(seen(mapped.table.rows, names)).toEqual(seen(rebuilt(table, mapped.table), names));
      if (mapped.table.rows.length > 0 && mapped.table.rows.every((r, i) => r === table.rows[i])) asIs += 1;
    }), { numRuns: 3000 });
    expect(asIs).toBeGreaterThan(100); // the rows were used as they are in many cases
  });

  it('leave out a cell under no header of the table, in a table built by hand', () => {
    const table: RawTable = {
      file: 'readings/2026-01-01.csv',
      header: [{ text: 'board', column: 1 }, { text: 'ref', column: 2 }],
      rows: [{ row: 2, cells: { board: { text: 'DB1', column: 1 }, ref: { text: '1', column: 2 }, zs_ohm: { text: '0.5', column: 3 } } }],
    };
    const mapped = mapColumns(table, {});
    expect(mapped.table.rows).toEqual([{ row: 2, cells: { board: { text: 'DB1', column: 1 }, ref: { text: '1', column: 2 } } }]);
  });
});
