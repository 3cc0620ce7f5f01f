// CSV files into raw tables: header names trimmed, every cell with its line and column.
// Strict on purpose, because a misread row can move a reading to another column or circuit:
// every row has exactly the header's number of cells, no cell spans lines (a stray quote would
// swallow the rows after it), and a file separated by semicolons or tabs (what spreadsheets
// write in many locales) is read with that separator.
import { parse } from 'csv-parse/sync';
import type { LocatedError, RawCell, RawTable } from './raw.js';
import { setOwn } from './own-field.js';

type Parsed = { record: string[]; info: { lines: number } };

const LINE_BREAK = /\r\n|\r|\n/g;
const QUOTE = 0x22;
const LF = 0x0a;
const CR = 0x0d;
const breaksIn = (s: string): number => s.match(LINE_BREAK)?.length ?? 0;
/** A "\r" not followed by "\n", or a "\n" not preceded by "\r". */
const MIXED_ENDING = /\r(?!\n)|(?<!\r)\n/;

/** The separator of a file: a comma, unless its header line has none but has semicolons or tabs. */
export function separatorOf(text: string): ',' | ';' | '\t' {
  const head = firstLine(text);
  if (head.includes(',')) return ',';
  if (head.includes(';')) return ';';
  if (head.includes('\t')) return '\t';
  return ',';
}

/**
 * The first line holding more than white space (a leading byte-order mark left out): the line
 * text.split(/\r\n|\r|\n/) would find first, without splitting the whole file. Each "\r" and
 * "\n" ends a line here, so "\r\n" leaves an empty line between, which is skipped as blank.
 */
function firstLine(text: string): string {
  for (let start = text.charCodeAt(0) === 0xfeff ? 1 : 0; start <= text.length;) {
    let end = start;
    while (end < text.length && text.charCodeAt(end) !== LF && text.charCodeAt(end) !== CR) end += 1;
    const line = text.slice(start, end);
    if (line.trim() !== '') return line;
    start = end + 1;
  }
  return '';
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

/**
 * The records of a plain file, read without csv-parse: what csv-parse gives (the records and the
 * line each ends on) for a file it reads without any error and where no cell spans lines. csv-parse
 * works on the file's UTF-8 bytes and, on its first line, builds three buffers for every byte while
 * it looks for the line ending; this reader takes one pass over the text. It reads only a file:
 *   - of well-formed UTF-16 (csv-parse would see a lone surrogate as U+FFFD) without NUL;
 *   - whose line endings are all "\n", or all "\r\n" (no lone "\r"): csv-parse ends records at the
 *     first kind it meets and counts a line at every "\r" and "\n";
 *   - whose every quote opens a cell (at its start), is closed on the same line by a quote followed
 *     by the separator, the line's end or the file's end, and doubles a quote inside.
 * Anything else (where csv-parse would refuse the text, or a cell runs over lines) is null: the
 * caller parses it with csv-parse. A leading byte-order mark is skipped, empty lines are skipped
 * (a line holding only "" is a record of one empty cell), as CSV_OPTIONS say.
 */
export function plainRecords(text: string, sep: string): Parsed[] | null {
  if (text.includes('\0') || !(text as string & { isWellFormed(): boolean }).isWellFormed()) return null;
  // where there is a "\r", every "\r" starts a "\r\n" and every "\n" ends one
  if (text.includes('\r') && MIXED_ENDING.test(text)) return null;
  const s = sep.charCodeAt(0);
  const n = text.length;
  const records: Parsed[] = [];
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let line = 1;
  let record: string[] = [];
  /** the next "\n" at or after the quoted cell being read (-1: none), found once per line, not per cell */
  let lf = -2;
  for (;;) {
    // at the start of a cell
    let cell: string;
    let quoted = false;
    if (i < n && text.charCodeAt(i) === QUOTE) {
      quoted = true;
      let from = i + 1;
      cell = '';
      for (;;) {
        const q = text.indexOf('"', from);
        if (q < 0) return null; // never closed
        if (lf !== -1 && lf < from) lf = text.indexOf('\n', from);
        // runs over lines (a "\r" stands only just before a "\n", so the "\n" tells for it too)
        if (lf !== -1 && lf < q) return null;
        if (text.charCodeAt(q + 1) === QUOTE) {
          cell += text.slice(from, q + 1);
          from = q + 2;
          continue;
        }
        cell += text.slice(from, q);
        i = q + 1;
        break;
      }
      const c = i < n ? text.charCodeAt(i) : -1;
      if (c !== -1 && c !== s && c !== LF && c !== CR) return null; // a closing quote followed by text
    } else {
      const start = i;
      while (i < n) {
        const c = text.charCodeAt(i);
        if (c === s || c === LF || c === CR) break;
        if (c === QUOTE) return null; // a quote inside a cell
        i += 1;
      }
      cell = text.slice(start, i);
    }
    const c = i < n ? text.charCodeAt(i) : -1;
    if (c === s) {
      record.push(cell);
      i += 1;
      continue;
    }
    // the end of a line (or of the file): an empty line is skipped
    if (quoted || record.length > 0 || cell !== '') {
      record.push(cell);
      records.push({ record, info: { lines: line } });
      record = [];
    }
    if (c === -1) break;
    i += c === CR ? 2 : 1;
    line += 1;
    if (i >= n) break;
  }
  return records;
}

export function readCsv(file: string, text: string): { table: RawTable; errors: LocatedError[] } {
  const errors: LocatedError[] = [];
  const empty = { file, header: [], rows: [] };
  const sep = separatorOf(text);
  // a plain file is read without csv-parse, and none of its cells spans lines
  const plain = plainRecords(text, sep);
  let records: Parsed[];
  try {
    records = plain ?? parseRecords(text, sep);
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
  const lineOf = (r: Parsed): number => (plain ? r.info.lines : r.info.lines - r.record.reduce((n, c) => n + breaksIn(c), 0));
  const [head, ...body] = records;
  if (!head) {
    errors.push({ file, row: 1, column: 1, message: 'the file is empty; expected a header row naming the columns' });
    return { table: empty, errors };
  }
  const header: RawCell[] = head.record.map((name, i) => ({ text: name.trim(), column: i + 1 }));
  const seen = new Map<string, number>();
  const headLine = lineOf(head); // once: a header of thousands of repeated names made this quadratic
  for (const h of header) {
    const first = seen.get(h.text);
    if (first !== undefined) {
      errors.push({ file, row: headLine, column: h.column, message: `column "${h.text}" appears twice (also column ${first})` });
    } else seen.set(h.text, h.column);
  }
  const rows = [];
  for (const rec of body) {
    const { record } = rec;
    if (!record.some((c) => c.trim() !== '')) continue;
    const line = lineOf(rec);
    const spans = plain ? -1 : record.findIndex((c) => breaksIn(c) > 0);
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
    for (let i = 0; i < header.length; i++) {
      const h = header[i]!;
      const text = (record[i] ?? '').trim();
      // a header "__proto__" is a column like any other, never the prototype its cells would lend fields to
      if (text !== '' && h.text !== '') setOwn(cells, h.text, { text, column: h.column });
    }
    rows.push({ row: line, cells });
  }
  return { table: { file, header, rows }, errors };
}
