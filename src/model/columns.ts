// Instrument exports: `readings.columns` in project.yaml maps an instrument's column headers
// ("Zs (Ω)", "IR L-E (MΩ)") onto packsmith's readings columns, so an export drops into readings/
// unedited. A header's unit, in brackets at its end, is the unit of the numbers written without
// one; a unit that does not fit the field is an error at the header. A column mapped to "ignore"
// is left out on purpose; a column neither known nor mapped stays, to be reported as unknown.
// circuits.csv has the same mapping (`circuits.columns`), without units in headers.
import type { LocatedError, RawCell, RawTable } from '../load/raw.js';
import { IGNORE_COLUMN, MEASURED, READING_COLUMNS, type MeasuredField } from './schema.js';
import { QUANTITIES, unitFits } from './units.js';
import { setOwn } from '../load/own-field.js';

export interface MappedTable {
  /** the table with its headers renamed to packsmith's columns and ignored columns removed */
  table: RawTable;
  /** the unit each measured column's header names, where it names one */
  units: Partial<Record<MeasuredField, string>>;
  errors: LocatedError[];
}

/** Headers and mapping keys compare as text after NFKC, so the ohm sign U+2126 matches Ω (U+03A9). */
const norm = (s: string): string => s.normalize('NFKC').trim();
const HEADER_UNIT = /[([]\s*([^()[\]]*?)\s*[)\]]\s*$/;
const isMeasured = (field: string): field is MeasuredField => field in MEASURED;

/**
 * `known`: the columns of the file (readings by default; circuits.csv passes its own);
 * `measured`: the columns whose header may name a unit (none for circuits.csv).
 */
export function mapColumns(
  table: RawTable, columns: Readonly<Record<string, string>>,
  known: readonly string[] = READING_COLUMNS, measured: Readonly<Record<string, unknown>> = MEASURED,
): MappedTable {
  const errors: LocatedError[] = [];
  const units: Partial<Record<MeasuredField, string>> = {};
  const mapping = new Map(Object.entries(columns).map(([k, v]) => [norm(k), v]));
  const renamed = new Map<string, string>(); // header as written → packsmith column
  const given = new Map<string, RawCell>(); // packsmith column → the header that gives it
  const header: RawCell[] = [];
  /** whether every column keeps its header: nothing renamed, ignored or given twice */
  let asWritten = true;
  for (const h of table.header) {
    const mapped = mapping.get(norm(h.text));
    if (mapped === IGNORE_COLUMN) {
      asWritten = false;
      continue;
    }
    const field = mapped ?? h.text;
    if (mapped !== undefined || known.includes(h.text)) {
      const first = given.get(field);
      if (first) {
        errors.push({ file: table.file, row: 1, column: h.column, message: `column "${h.text}" gives ${field}, as column ${first.column} "${first.text}" does; one column per field` });
        asWritten = false;
        continue;
      }
      given.set(field, h);
    }
    if (mapped !== undefined && field in measured && isMeasured(field)) {
      const unit = HEADER_UNIT.exec(h.text)?.[1];
      if (unit !== undefined && unit !== '') {
        const q = QUANTITIES[MEASURED[field]];
        if (!unitFits(unit, MEASURED[field])) {
          errors.push({ file: table.file, row: 1, column: h.column, message: `column "${h.text}" is mapped to ${field}, but its unit "${unit}" does not fit ${q.words} (accepted: ${Object.keys(q.units).join(', ')})` });
        } else units[field] = unit;
      }
    }
    if (field !== h.text) asWritten = false;
    renamed.set(h.text, field);
    header.push({ text: field, column: h.column });
  }
  // cells of ignored columns and of a second column giving the same field are left out
  const rows = table.rows.map((r) => (asWritten && keptAsIs(r.cells, renamed) ? r : { row: r.row, cells: renamedCells(r.cells, renamed) }));
  return { table: { file: table.file, header, rows }, units, errors };
}

/**
 * Whether a row's cells are what renaming them would make, where every column keeps its header:
 * a plain object (a header "__proto__" sets the prototype of the cells, which a copy leaves behind)
 * whose every cell is under a header of the table. Such a row is used as it is (shared, not
 * copied: validation only reads it).
 */
function keptAsIs(cells: Record<string, RawCell>, renamed: ReadonlyMap<string, string>): boolean {
  if (Object.getPrototypeOf(cells) !== Object.prototype) return false;
  for (const name of Object.keys(cells)) if (!renamed.has(name)) return false;
  return true;
}

/** A row's cells under their new names (in the order of the row's own keys), those with none left out. */
function renamedCells(cells: Record<string, RawCell>, renamed: ReadonlyMap<string, string>): Record<string, RawCell> {
  const out: Record<string, RawCell> = {};
  for (const name of Object.keys(cells)) {
    const to = renamed.get(name);
    if (to !== undefined) setOwn(out, to, cells[name]!);
  }
  return out;
}
