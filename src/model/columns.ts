// Instrument exports: `readings.columns` in project.yaml maps an instrument's column headers
// ("Zs (Ω)", "IR L-E (MΩ)") onto packsmith's readings columns, so an export drops into readings/
// unedited. A header's unit, in brackets at its end, is the unit of the numbers written without
// one; a unit that does not fit the field is an error at the header. A column mapped to "ignore"
// is left out on purpose; a column neither known nor mapped stays, to be reported as unknown.
// circuits.csv has the same mapping (`circuits.columns`), without units in headers.
import type { LocatedError, RawCell, RawTable } from '../load/raw.js';
import { IGNORE_COLUMN, MEASURED, READING_COLUMNS, type MeasuredField } from './schema.js';
import { QUANTITIES, unitFits } from './units.js';

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
  for (const h of table.header) {
    const mapped = mapping.get(norm(h.text));
    if (mapped === IGNORE_COLUMN) continue;
    const field = mapped ?? h.text;
    if (mapped !== undefined || known.includes(h.text)) {
      const first = given.get(field);
      if (first) {
        errors.push({ file: table.file, row: 1, column: h.column, message: `column "${h.text}" gives ${field}, as column ${first.column} "${first.text}" does; one column per field` });
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
    renamed.set(h.text, field);
    header.push({ text: field, column: h.column });
  }
  // cells of ignored columns and of a second column giving the same field are left out
  const rows = table.rows.map((r) => ({
    row: r.row,
    cells: Object.fromEntries(Object.entries(r.cells).flatMap(([name, cell]) => {
      const to = renamed.get(name);
      return to === undefined ? [] : [[to, cell] as const];
    })),
  }));
  return { table: { file: table.file, header, rows }, units, errors };
}
