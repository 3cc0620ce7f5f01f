// The raw records read from a job folder: text as written, with the position of every value,
// so that validation can report `file:row:column: message`.
import type { Firm } from './firm.js';

/** Where a value stands: file relative to the job folder, 1-based line and column. */
export interface SourcePosition {
  file: string;
  row: number;
  column: number;
}

export interface RawCell {
  text: string;
  column: number;
}

export interface RawRow {
  /** line of the record in the file (the header is line 1) */
  row: number;
  cells: Record<string, RawCell>;
}

export interface RawTable {
  file: string;
  /** header cells as written, with their column numbers */
  header: RawCell[];
  rows: RawRow[];
}

export interface RawYaml {
  file: string;
  /** the parsed document (plain JS values) */
  data: unknown;
  /** position of a value by its path, e.g. ['supply', 'ze_ohm'] */
  positionOf(path: readonly PropertyKey[]): SourcePosition;
}

export interface RawSession {
  /** YYYY-MM-DD from the file name */
  date: string;
  /** the optional label after the date */
  label: string;
  table: RawTable;
}

export interface RawJob {
  /** the job folder's name: used in output paths */
  name: string;
  dir: string;
  /** project.yaml with the firm file's settings merged beneath it (see load/firm.ts) */
  project: RawYaml | null;
  /** the firm settings that apply (the nearest packsmith.yaml above the job), or null */
  firm: Firm | null;
  circuits: RawTable | null;
  sessions: RawSession[];
  notes: { file: string; text: string } | null;
  /** every input file read, relative path → bytes (for hashing) */
  files: Map<string, Buffer>;
  /** problems found while reading (missing files, unparsable YAML/CSV, bad file names) */
  errors: LocatedError[];
}

export interface LocatedError extends SourcePosition {
  message: string;
}

export function formatError(e: LocatedError): string {
  return `${e.file}:${e.row}:${e.column}: ${e.message}`;
}
