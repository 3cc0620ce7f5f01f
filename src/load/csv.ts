// CSV files into raw tables: header names trimmed, every cell with its line and column.
import { parse } from 'csv-parse/sync';
import type { LocatedError, RawCell, RawTable } from './raw.js';

export function readCsv(file: string, text: string): { table: RawTable; errors: LocatedError[] } {
  const errors: LocatedError[] = [];
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, { bom: true, info: true, relax_column_count: true, skip_empty_lines: true }) as unknown as typeof records;
  } catch (err) {
    const e = err as { lines?: number; message?: string };
    errors.push({ file, row: e.lines ?? 1, column: 1, message: `cannot read this CSV file: ${e.message ?? String(err)}` });
    return { table: { file, header: [], rows: [] }, errors };
  }
  const [head, ...body] = records;
  if (!head) {
    errors.push({ file, row: 1, column: 1, message: 'the file is empty; expected a header row naming the columns' });
    return { table: { file, header: [], rows: [] }, errors };
  }
  const header: RawCell[] = head.record.map((name, i) => ({ text: name.trim(), column: i + 1 }));
  const seen = new Map<string, number>();
  for (const h of header) {
    const first = seen.get(h.text);
    if (first !== undefined) {
      errors.push({ file, row: head.info.lines, column: h.column, message: `column "${h.text}" appears twice (also column ${first})` });
    } else seen.set(h.text, h.column);
  }
  const rows = body
    .filter(({ record }) => record.some((c) => c.trim() !== ''))
    .map(({ record, info }) => {
      if (record.length > header.length) {
        errors.push({
          file, row: info.lines, column: header.length + 1,
          message: `this row has ${record.length} cells but the header names ${header.length} columns`,
        });
      }
      const cells: Record<string, RawCell> = {};
      header.forEach((h, i) => {
        const text = (record[i] ?? '').trim();
        if (text !== '' && h.text !== '') cells[h.text] = { text, column: h.column };
      });
      return { row: info.lines, cells };
    });
  return { table: { file, header, rows }, errors };
}
