// Property: a malformed cell in a readings file always gives an error located at that cell, and
// no cell whatever makes validation (or assessment) crash.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fileURLToPath } from 'node:url';
import { readJob } from '../../src/load/job.js';
import { readCsv } from '../../src/load/csv.js';
import type { RawJob } from '../../src/load/raw.js';
import { validate } from '../../src/model/validate.js';
import { assess } from '../../src/calc/assess.js';
import { MEASURED, type MeasuredField } from '../../src/model/schema.js';

const BASE = readJob(fileURLToPath(new URL('../fixtures/tt-instrument-job/', import.meta.url)));
const FILE = 'readings/2026-11-13.csv';
const quote = (cell: string) => `"${cell.replace(/"/g, '""')}"`;

/** The fixture job with one readings session made of this header and these rows. */
function jobWith(header: string[], rows: string[][]): RawJob {
  const text = [header, ...rows].map((r) => r.map(quote).join(',')).join('\n');
  const { table, errors } = readCsv(FILE, `${text}\n`);
  return { ...BASE, errors: [...BASE.errors, ...errors], sessions: [{ date: '2026-11-13', label: '', table }] };
}

const fields = Object.keys(MEASURED) as MeasuredField[];
const positive = fc.integer({ min: 1, max: 100_000 }).map((n) => String(n / 100));
const word = fc.stringMatching(/^[a-z]{3,8}$/);

/** Cells that can never be a valid value of the field, with what is wrong with them. */
function malformed(field: MeasuredField): fc.Arbitrary<string> {
  const common = [
    fc.tuple(fc.integer({ min: 0, max: 999 }), fc.integer({ min: 1, max: 99 }), fc.boolean()).map(([a, b, gt]) => `${gt ? '>' : ''}${a},${b}`), // decimal comma
    positive.map((v) => `-${v}`), // negative
    fc.tuple(positive, fc.constantFrom('ft', 'kg', 'Hz', 'bar', '%', 'lb', 'W', 'psi')).map(([v, u]) => `${v} ${u}`), // not a unit of it
    word, // not a value
  ];
  if (MEASURED[field] === 'millisecond') {
    common.push(fc.integer({ min: 1, max: 999 }).map((n) => `0.${String(n).padStart(3, '0')}`)); // seconds where ms are expected
    common.push(positive.map((v) => `${v} s`));
  }
  if (MEASURED[field] === 'ohm') common.push(positive.map((v) => `${v} MΩ`)); // megohms in an ohms field
  return fc.oneof(...common);
}

describe('malformed cells (fast-check)', () => {
  it('always give an error at file:row:column of the cell', () => {
    const cases = fc.constantFrom(...fields).chain((field) => malformed(field).map((cell) => ({ field, cell })));
    fc.assert(fc.property(cases, fc.integer({ min: 0, max: 2 }), ({ field, cell }, before) => {
      // the bad cell stands after `before` good rows, in the third column
      const good = [['CU1', '2', '0.5'], ['CU1', '3', '0.5']].slice(0, before);
      const v = validate(jobWith(['board', 'ref', field], [...good, ['CU1', '1', cell]]));
      expect(v.ok).toBe(false);
      if (v.ok) return;
      const row = before + 2;
      expect(v.errors, `${field} = ${cell}`).toContainEqual(expect.objectContaining({ file: FILE, row, column: 3 }));
    }), { numRuns: 200 });
  });

  it('never crash validation or assessment, whatever the cells hold', () => {
    const header = ['board', 'ref', 'zs_ohm', 'ir_le_mohm', 'rcd_1x_ms', 'polarity'];
    const anyCell = fc.oneof(fc.string(), fc.string({ unit: 'binary' }), fc.constantFrom('CU1', '1', '2', '>999', 'n/a', '0.5', ''));
    fc.assert(fc.property(fc.array(fc.array(anyCell, { minLength: 0, maxLength: 8 }), { minLength: 1, maxLength: 4 }), (rows) => {
      const v = validate(jobWith(header, rows));
      if (v.ok) {
        expect(() => assess(v.project)).not.toThrow();
        return;
      }
      for (const e of v.errors) {
        expect(e.row).toBeGreaterThanOrEqual(1);
        expect(e.column).toBeGreaterThanOrEqual(1);
        expect(e.message.length).toBeGreaterThan(0);
      }
    }), { numRuns: 200 });
  });
});
