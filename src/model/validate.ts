// Raw records → the validated Project. Every problem is collected (never only the first) and
// located as file:row:column, in words a site electrician understands.
import type { z } from 'zod';
import type { LocatedError, RawJob, RawRow, RawTable, RawYaml } from '../load/raw.js';
import { FirmFileSchema } from './firm.js';
import {
  CIRCUIT_COLUMNS, CIRCUIT_REQUIRED, CircuitSchema, ProjectFileSchema, READING_COLUMNS, readingRowSchema,
  ReadingsSettingsSchema, CircuitsSettingsSchema, type Circuit, type ProjectFile, type ReadingsSettings,
} from './schema.js';
import { mapColumns } from './columns.js';
import { circuitKey, mergeSessions, type CircuitReadings, type SessionRow } from './readings.js';
import { ratingProblem } from './device-rating.js';
import { deviceHint } from './device-hint.js';
import { setOwn } from '../load/own-field.js';

export interface CircuitRecord extends Circuit {
  /** line of the circuit in circuits.csv */
  row: number;
}

export interface Project {
  /** the job folder's name */
  name: string;
  file: ProjectFile;
  circuits: CircuitRecord[];
  readings: Map<string, CircuitReadings>;
  /** every readings row, in session order (oldest first): to assess a circuit as of each session */
  rows: SessionRow[];
  sessions: { date: string; label: string; file: string }[];
  notes: string | null;
}

export type Validation = { ok: true; project: Project } | { ok: false; errors: LocatedError[] };

function describe(issue: z.core.$ZodIssue): string {
  return issue.message;
}

/** Where the format is described, for messages (generated from these schemas: npm run docs). */
export const FORMAT_DOC = 'docs/job-folder.md';

function yamlErrors(job: RawJob): { file: ProjectFile | null; errors: LocatedError[] } {
  const firm = job.firm?.doc ? parseYaml(job.firm.doc, FirmFileSchema).errors : [];
  if (!job.project) return { file: null, errors: firm };
  const own = parseYaml(job.project, ProjectFileSchema);
  return { file: own.data, errors: [...firm, ...own.errors] };
}

function parseYaml<S extends z.ZodType>(doc: RawYaml, schema: S): { data: z.output<S> | null; errors: LocatedError[] } {
  const parsed = schema.safeParse(doc.data);
  if (parsed.success) return { data: parsed.data, errors: [] };
  const errors: LocatedError[] = [];
  for (const issue of parsed.error.issues) {
    const path = issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p));
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        const where = [...path, key].join('.');
        errors.push({ ...doc.positionOf([...path, key]), message: `${where}: unknown field; check its spelling against ${FORMAT_DOC}` });
      }
      continue;
    }
    const where = path.length > 0 ? `${path.join('.')}: ` : '';
    errors.push({ ...doc.positionOf(path), message: `${where}${describe(issue)}` });
  }
  return { data: null, errors };
}

/** A row the schema accepted: its line, its values, and its cells as read (for the columns of later findings). */
type ParsedRow<S extends z.ZodType> = { row: number; values: z.output<S>; cells: RawRow['cells'] };

/** Parse every row of a table with a zod schema; unknown and missing columns reported once. */
function tableRows<S extends z.ZodType>(
  table: RawTable,
  schema: S,
  known: readonly string[],
  required: readonly string[],
  errors: LocatedError[],
  hint = '',
  cellHint: (field: string, text: string) => string = () => '',
): ParsedRow<S>[] {
  const headerRow = 1;
  const names = new Set(table.header.map((h) => h.text));
  for (const h of table.header) {
    if (h.text !== '' && !known.includes(h.text)) {
      errors.push({ file: table.file, row: headerRow, column: h.column, message: `unknown column "${h.text}"; the columns packsmith reads are: ${known.join(', ')}${hint}` });
    }
  }
  const missing = required.filter((r) => !names.has(r));
  if (missing.length > 0) {
    errors.push({ file: table.file, row: headerRow, column: 1, message: `missing column${missing.length > 1 ? 's' : ''} ${missing.map((m) => `"${m}"`).join(', ')}${hint}` });
  }
  const out: ParsedRow<S>[] = [];
  for (const r of table.rows) {
    const parsed = schema.safeParse(cellTexts(r.cells));
    if (parsed.success) {
      out.push({ row: r.row, values: parsed.data, cells: r.cells });
      continue;
    }
    for (const issue of parsed.error.issues) {
      const field = String(issue.path[0] ?? '');
      if (missing.includes(field)) continue; // already reported at the header
      const column = r.cells[field]?.column ?? table.header.find((h) => h.text === field)?.column ?? 1;
      const text = r.cells[field]?.text;
      errors.push({ file: table.file, row: r.row, column, message: `${field}: ${describe(issue)}${text === undefined ? '' : cellHint(field, text)}` });
    }
  }
  return out;
}

/** A row's cells as text, by column, in the order of the row's own keys. */
function cellTexts(cells: RawRow['cells']): Record<string, string> {
  const out: Record<string, string> = {};
  for (const k of Object.keys(cells)) setOwn(out, k, cells[k]!.text);
  return out;
}

/**
 * A further rule on a valid circuit row (e.g. the calculation's tables), injected by the caller;
 * `file` is the valid project.yaml, where it is valid, for rules that compare the two.
 */
export type CircuitRule = (circuit: Circuit, file: ProjectFile | null) => { field: string; message: string } | null;

export interface ValidateOptions {
  /** today's date (YYYY-MM-DD), passed in by the caller that reads the clock: a test session dated later is an error */
  today?: string;
}

/**
 * A further rule on a valid project.yaml with the BOARD/REF keys of circuits.csv (e.g. the tree of
 * boards), injected by the caller: each problem names the path of the project.yaml value it is about.
 */
export type ProjectRule = (file: ProjectFile, circuitKeys: ReadonlySet<string>) => { path: (string | number)[]; message: string }[];

export function validate(job: RawJob, circuitRules: readonly CircuitRule[] = [], projectRules: readonly ProjectRule[] = [], opts: ValidateOptions = {}): Validation {
  const errors: LocatedError[] = [...job.errors];
  const { file, errors: yErrors } = yamlErrors(job);
  for (const e of yErrors) errors.push(e);

  const circuits: CircuitRecord[] = [];
  const known = new Set<string>();
  const boards = boardIds(job);
  if (job.circuits) {
    const mapped = mapColumns(job.circuits, circuitSettings(job, file).columns, CIRCUIT_COLUMNS, {});
    errors.push(...mapped.errors);
    const table = mapped.table;
    // Identity first, on the raw cells, so a row with other mistakes is still checked.
    const seen = new Map<string, number>();
    const duplicate = new Set<number>();
    for (const r of table.rows) {
      const board = r.cells.board?.text;
      const ref = r.cells.ref?.text;
      if (board && boards && !boards.has(board)) {
        errors.push({ file: table.file, row: r.row, column: r.cells.board!.column, message: `board "${board}" is not listed under boards in project.yaml (listed: ${[...boards].join(', ')})` });
      }
      if (!board || !ref) continue;
      const key = circuitKey(board, ref);
      const first = seen.get(key);
      if (first !== undefined) {
        errors.push({ file: table.file, row: r.row, column: r.cells.ref!.column, message: `circuit ${ref} on ${board} is listed twice (also row ${first})` });
        duplicate.add(r.row);
      } else seen.set(key, r.row);
      known.add(key);
    }
    const rules: CircuitRule[] = [
      (c) => { const m = ratingProblem(c.device, c.rating_a); return m ? { field: 'rating_a', message: m } : null; },
      ...circuitRules,
    ];
    for (const { row, values, cells } of tableRows(table, CircuitSchema, CIRCUIT_COLUMNS, CIRCUIT_REQUIRED, errors, '', circuitHint)) {
      const problems = rules.map((rule) => rule(values, file)).filter((p) => p !== null);
      for (const p of problems) {
        const column = cells[p.field]?.column ?? table.header.find((h) => h.text === p.field)?.column ?? 1;
        errors.push({ file: table.file, row, column, message: `${p.field}: ${p.message}` });
      }
      // the parsed row itself becomes the record (zod made it for this row alone; a copy of its
      // twenty-odd fields took longer than the row's rules)
      if (problems.length === 0 && !duplicate.has(row)) circuits.push(Object.assign(values, { row }));
    }
  }

  const sessionRows: SessionRow[] = [];
  const { columns } = readingSettings(job, file);
  for (const s of job.sessions) {
    if (opts.today !== undefined && s.date > opts.today) {
      errors.push({ file: s.table.file, row: 1, column: 1, message: `test session dated ${s.date}, after today (${opts.today}); a readings file is named after the day its tests were done` });
    }
    const mapped = mapColumns(s.table, columns);
    for (const e of mapped.errors) errors.push(e);
    const table = mapped.table;
    const seen = new Map<string, number>();
    const skip = new Set<number>();
    for (const r of table.rows) {
      const board = r.cells.board?.text;
      const ref = r.cells.ref?.text;
      if (!board || !ref) continue;
      const key = circuitKey(board, ref);
      const first = seen.get(key);
      if (boards && !boards.has(board)) {
        errors.push({ file: table.file, row: r.row, column: r.cells.board!.column, message: `board "${board}" is not listed under boards in project.yaml (listed: ${[...boards].join(', ')})` });
        skip.add(r.row);
      } else if (job.circuits && !known.has(key)) {
        errors.push({ file: table.file, row: r.row, column: r.cells.ref!.column, message: `no circuit ${ref} on board ${board} in circuits.csv` });
        skip.add(r.row);
      } else if (first !== undefined) {
        errors.push({ file: table.file, row: r.row, column: r.cells.ref!.column, message: `circuit ${ref} on ${board} appears twice in this session (also row ${first}); one row per circuit per session` });
        skip.add(r.row);
      } else seen.set(key, r.row);
    }
    for (const { row, values } of tableRows(table, readingRowSchema(mapped.units), READING_COLUMNS, ['board', 'ref'], errors, MAP_HINT)) {
      if (!skip.has(row)) sessionRows.push({ date: s.date, file: table.file, row, values });
    }
  }

  if (file && job.project && job.circuits) {
    for (const rule of projectRules) {
      for (const p of rule(file, known)) errors.push({ ...job.project.positionOf(p.path), message: p.message });
    }
  }

  if (errors.length > 0 || !file) return { ok: false, errors: sortErrors(errors, job) };
  return {
    ok: true,
    project: {
      name: job.name,
      file,
      circuits,
      readings: mergeSessions(sessionRows),
      rows: sessionRows,
      sessions: job.sessions.map((s) => ({ date: s.date, label: s.label, file: s.table.file })),
      notes: job.notes?.text ?? null,
    },
  };
}

/** A device written the usual ways ("B32", "C16 RCBO") gets a hint at its code and rating. */
const circuitHint = (field: string, text: string): string => (field === 'device' ? deviceHint(text) : '');

const MAP_HINT = '; an instrument\'s column is mapped onto one of these (or to "ignore") under readings.columns in project.yaml';

/** The readings settings of project.yaml, even when other parts of it are invalid. */
function readingSettings(job: RawJob, file: ProjectFile | null): ReadingsSettings {
  if (file) return file.readings;
  const raw = (job.project?.data as { readings?: unknown } | null)?.readings;
  const parsed = ReadingsSettingsSchema.safeParse(raw ?? {});
  return parsed.success ? parsed.data : { columns: {} };
}

/** The circuits settings of project.yaml, even when other parts of it are invalid. */
function circuitSettings(job: RawJob, file: ProjectFile | null): { columns: Record<string, string> } {
  if (file) return file.circuits;
  const raw = (job.project?.data as { circuits?: unknown } | null)?.circuits;
  const parsed = CircuitsSettingsSchema.safeParse(raw ?? {});
  return parsed.success ? parsed.data : { columns: {} };
}

/** Board ids as written in project.yaml, even when other parts of it are invalid. */
function boardIds(job: RawJob): Set<string> | null {
  const boards = (job.project?.data as { boards?: unknown } | null)?.boards;
  if (!Array.isArray(boards)) return null;
  return new Set(boards.map((b) => String((b as { id?: unknown } | null)?.id ?? '')).filter((id) => id !== ''));
}

/** Errors shown per file: a file broken throughout says so once it has shown this many. */
export const MAX_ERRORS_PER_FILE = 200;

/** Every problem once (a firm file's value is checked as the firm's and as the job's), in file order, at most MAX_ERRORS_PER_FILE per file. */
function sortErrors(errors: LocatedError[], job: RawJob): LocatedError[] {
  const order = [...(job.firm ? [job.firm.file] : []), 'project.yaml', 'circuits.csv', ...job.sessions.map((s) => s.table.file)];
  const rank = (f: string) => (order.indexOf(f) === -1 ? order.length : order.indexOf(f));
  const seen = new Set<string>();
  const once = errors.filter((e) => {
    const k = `${e.file}:${e.row}:${e.column}: ${e.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
  const sorted = once.sort((a, b) => rank(a.file) - rank(b.file) || a.file.localeCompare(b.file) || a.row - b.row || a.column - b.column);
  const shown: LocatedError[] = [];
  const perFile = new Map<string, number>();
  for (const e of sorted) {
    const n = (perFile.get(e.file) ?? 0) + 1;
    perFile.set(e.file, n);
    if (n <= MAX_ERRORS_PER_FILE) shown.push(e);
    else if (n === MAX_ERRORS_PER_FILE + 1) {
      const more = sorted.filter((x) => x.file === e.file).length - MAX_ERRORS_PER_FILE;
      shown.push({ ...e, message: `and ${more} more problem(s) in ${e.file} from here on; fix the ones above first (is it the right file?)` });
    }
  }
  return shown;
}
