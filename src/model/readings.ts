// Test sessions merged into one record per circuit: a later session's value supersedes an
// earlier one field by field; each value keeps the date it was measured and what it replaced.
// A measurement stands until it is measured again: a later "n/a" or "not-tested" does not set
// aside an earlier reading or result (a failing insulation reading is not cleared by a re-test
// that could not make the test).
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

/** Whether a value records that nothing was measured: a reading or an outcome marked n/a or not tested. */
export function unmeasured(value: unknown): boolean {
  if (value === 'n/a' || value === 'not-tested') return true;
  const kind = typeof value === 'object' && value !== null ? (value as { kind?: unknown }).kind : undefined;
  return kind === 'n/a' || kind === 'not-tested';
}

/** Merge rows given in session order (oldest first). */
export function mergeSessions(rows: SessionRow[]): Map<string, CircuitReadings> {
  const merged = new Map<string, CircuitReadings>();
  for (const { date, file, row, values } of rows) {
    const key = circuitKey(values.board, values.ref);
    const record: Record<string, Measured<unknown>> = (merged.get(key) ?? {}) as Record<string, Measured<unknown>>;
    for (const [field, value] of Object.entries(values)) {
      if (field === 'board' || field === 'ref' || value === undefined) continue;
      const before = record[field];
      // a measurement stands until it is measured again
      if (before && unmeasured(value) && !unmeasured(before.value)) continue;
      const earlier = before ? [...before.earlier, { value: before.value, date: before.date, file: before.file }] : [];
      record[field] = { value, date, file, row, earlier };
    }
    merged.set(key, record as CircuitReadings);
  }
  return merged;
}

/** A field's value as recorded in one session (by its readings file): the value `m` holds, or one it superseded. */
export type SessionValue<T> = Pick<Measured<T>, 'value' | 'date' | 'file'>;

/** The value of `m`'s field that the session of `file` recorded; undefined where that session recorded none. */
export function inSession<T>(m: Measured<T> | undefined, file: string): SessionValue<T> | undefined {
  if (!m) return undefined;
  return m.file === file ? m : m.earlier.find((e) => e.file === file);
}
