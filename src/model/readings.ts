// Test sessions merged into one record per circuit: a later session's value supersedes an
// earlier one field by field; each value keeps the date it was measured and what it replaced.
import type { ReadingField, ReadingRow } from './schema.js';

export interface Measured<T> {
  value: T;
  /** the test date (from the session's file name) */
  date: string;
  file: string;
  row: number;
  /** earlier values of this field, oldest first */
  earlier: { value: T; date: string; file: string }[];
}

export type CircuitReadings = { [K in ReadingField]?: Measured<NonNullable<ReadingRow[K]>> };

export interface SessionRow {
  date: string;
  file: string;
  row: number;
  values: ReadingRow;
}

export const circuitKey = (board: string, ref: string): string => `${board}/${ref}`;

/** Merge rows given in session order (oldest first). */
export function mergeSessions(rows: SessionRow[]): Map<string, CircuitReadings> {
  const merged = new Map<string, CircuitReadings>();
  for (const { date, file, row, values } of rows) {
    const key = circuitKey(values.board, values.ref);
    const record: Record<string, Measured<unknown>> = (merged.get(key) ?? {}) as Record<string, Measured<unknown>>;
    for (const [field, value] of Object.entries(values)) {
      if (field === 'board' || field === 'ref' || value === undefined) continue;
      const before = record[field];
      const earlier = before ? [...before.earlier, { value: before.value, date: before.date, file: before.file }] : [];
      record[field] = { value, date, file, row, earlier };
    }
    merged.set(key, record as CircuitReadings);
  }
  return merged;
}
