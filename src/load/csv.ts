// CSV files into raw tables: header names trimmed, every cell with its line and column.
// Strict on purpose, because a misread row can move a reading to another column or circuit:
// every row has exactly the header's number of cells, no cell spans lines (a stray quote would
// swallow the rows after it), and a file separated by semicolons or tabs (what spreadsheets
// write in many locales) is read with that separator.
import { parse } from 'csv-parse/sync';
import type { LocatedError, RawCell, RawTable } from './raw.js';

type Parsed = { record: string[]; info: { lines: number } };

const LINE_BREAK = /\r\n|\r|\n/g;
const breaksIn = (s: string): number => s.match(LINE_BREAK)?.length ?? 0;

/** The separator of a file: a comma, unless its header line has none but has semicolons or tabs. */
export function separatorOf(text: string): ',' | ';' | '\t' {
  const head = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/).find((l) => l.trim() !== '') ?? '';
  if (head.includes(',')) return ',';
  if (head.includes(';')) return ';';
  if (head.includes('\t')) return '\t';
  return ',';
}

/** Where a quote that is never closed was opened (RFC 4180: a quote opens only at a cell's start). */
function unclosedQuote(text: string, sep: string): { row: number; column: number } | null {
  let row = 1;
  let col = 0;
  let atStart = true;
  let open: { row: number; column: number } | null = null;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    col += 1;
    if (open) {
      if (ch === '"') {
        if (text[i + 1] === '"') { i += 1; col += 1; } else open = null;
      } else if (ch === '\n') { row += 1; col = 0; }
      continue;
    }
    if (ch === '\n') { row += 1; col = 0; atStart = true; continue; }
    if (ch === '"' && atStart) { open = { row, column: col }; continue; }
    atStart = ch === sep || ch === '\r';
  }
  return open;
}

export const CSV_OPTIONS = { bom: true, info: true, relax_column_count: true, skip_empty_lines: true } as const;

/**
 * The header record, then the records after it, parsed apart. csv-parse compares every record's
 * length with the first one's and, even with relax_column_count, builds an error object for each
 * that differs (a stack trace and a deep copy of its state: a file of 140,000 rows one cell too
 * many took ten times as long to read as a well-formed one). This reader compares each row with
 * the header itself, so the rows are parsed from the line after the header (csv-parse reads the
 * lines before from_line without making records of them), and compared by csv-parse with the
 * first row. The records, their lines and any error are those of one parse of the whole file.
 */
export function parseRecords(text: string, sep: string): Parsed[] {
  const [head] = parse(text, { ...CSV_OPTIONS, delimiter: sep, to: 1 }) as unknown as Parsed[];
  if (!head) return [];
  return [head, ...(parse(text, { ...CSV_OPTIONS, delimiter: sep, from_line: head.info.lines + 1 }) as unknown as Parsed[])];
}

export function readCsv(file: string, text: string): { table: RawTable; errors: LocatedError[] } {
  const errors: LocatedError[] = [];
  const empty = { file, header: [], rows: [] };
  const sep = separatorOf(text);
  let records: Parsed[];
  try {
    records = parseRecords(text, sep);
  } catch (err) {
    const e = err as { code?: string; lines?: number; message?: string };
    if (e.code === 'CSV_QUOTE_NOT_CLOSED') {
      const at = unclosedQuote(text.replace(/^\uFEFF/, ''), sep) ?? { row: e.lines ?? 1, column: 1 };
      errors.push({ file, ...at, message: 'a quote opens this cell and is never closed, so the rest of the file would be one cell; remove the stray quote (or close it on the same line)' });
    } else {
      errors.push({ file, row: e.lines ?? 1, column: 1, message: `cannot read this CSV file: ${(e.message ?? String(err)).split('\n')[0]}; a quote may only open and close a whole cell` });
    }
    return { table: empty, errors };
  }
  const lineOf = (r: Parsed): number => r.info.lines - r.record.reduce((n, c) => n + breaksIn(c), 0);
  const [head, ...body] = records;
  if (!head) {
    errors.push({ file, row: 1, column: 1, message: 'the file is empty; expected a header row naming the columns' });
    return { table: empty, errors };
  }
  const header: RawCell[] = head.record.map((name, i) => ({ text: name.trim(), column: i + 1 }));
  const seen = new Map<string, number>();
  for (const h of header) {
    const first = seen.get(h.text);
    if (first !== undefined) {
      errors.push({ file, row: lineOf(head), column: h.column, message: `column "${h.text}" appears twice (also column ${first})` });
    } else seen.set(h.text, h.column);
  }
  const rows = [];
  for (const rec of body) {
    const { record } = rec;
    if (!record.some((c) => c.trim() !== '')) continue;
    const line = lineOf(rec);
    const spans = record.findIndex((c) => breaksIn(c) > 0);
    if (spans >= 0) {
      errors.push({
        file, row: line, column: spans + 1,
        message: `this cell runs over ${breaksIn(record[spans]!) + 1} lines (to line ${rec.info.lines}), taking the rows after it with it; a cell never spans lines: remove the stray quote`,
      });
      continue;
    }
    if (record.length !== header.length) {
      const short = record.length < header.length;
      errors.push({
        file, row: line, column: short ? record.length : header.length + 1,
        message: short
          ? `this row has ${record.length} cells but the header names ${header.length} columns (the last given is "${header[record.length - 1]?.text ?? ''}"); write every cell, leaving an empty one between commas where there is nothing`
          : `this row has ${record.length} cells but the header names ${header.length} columns; a cell holding a comma is written in quotes`,
      });
      continue;
    }
    const cells: Record<string, RawCell> = {};
    header.forEach((h, i) => {
      const text = (record[i] ?? '').trim();
      if (text !== '' && h.text !== '') cells[h.text] = { text, column: h.column };
    });
    rows.push({ row: line, cells });
  }
  return { table: { file, header, rows }, errors };
}
