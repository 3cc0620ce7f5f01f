// A test session recorded in the browser, written as a new readings/YYYY-MM-DD[-label].csv after
// the validation `check` uses: the new file is validated with the job's other files, exactly as
// it will be read, before it is written; it is written whole or not at all and never replaces a file.
import { linkSync, mkdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { readJob, sessionOrder } from '../load/job.js';
import { readCsv } from '../load/csv.js';
import type { LocatedError } from '../load/raw.js';
import { validate } from '../model/validate.js';
import { circuitKey } from '../model/readings.js';
import { READING_COLUMNS, type ReadingField } from '../model/schema.js';
import type { Circuit } from '../model/schema.js';
import { CALC_RULES, PROJECT_RULES } from '../calc/inputs.js';
import { today } from '../commands/today.js';
import { fsyncDir, workingName, writeNew } from '../archive/files.js';

export interface Field {
  name: ReadingField;
  label: string;
  /** what to type: the unit, or the choices */
  hint: string;
  choices?: readonly string[];
}

const OUTCOME = ['ok', 'fail', 'n/a', 'not-tested'] as const;

const RING: Field[] = [
  { name: 'ring_r1_ohm', label: 'Ring r1 (line, end to end)', hint: 'Ω' },
  { name: 'ring_rn_ohm', label: 'Ring rn (neutral, end to end)', hint: 'Ω' },
  { name: 'ring_r2_ohm', label: 'Ring r2 (cpc, end to end)', hint: 'Ω' },
];
const ALL: Field[] = [
  { name: 'r1r2_ohm', label: 'R1+R2', hint: 'Ω' },
  { name: 'ir_test_v', label: 'Insulation test voltage', hint: 'V' },
  { name: 'ir_ll_mohm', label: 'Insulation L-L / L-N', hint: 'MΩ' },
  { name: 'ir_le_mohm', label: 'Insulation L-E', hint: 'MΩ' },
  { name: 'polarity', label: 'Polarity', hint: 'result', choices: OUTCOME },
  { name: 'zs_ohm', label: 'Zs', hint: 'Ω' },
];
const RCD: Field[] = [
  { name: 'rcd_1x_ms', label: 'RCD at 1× IΔn', hint: 'ms' },
  { name: 'rcd_5x_ms', label: 'RCD at 5× IΔn', hint: 'ms' },
  { name: 'rcd_button', label: 'RCD test button', hint: 'result', choices: OUTCOME },
];
const NOTES: Field = { name: 'notes', label: 'Notes', hint: 'text' };

/** The readings that apply to a circuit: ring columns only for a ring, RCD times only where it has an RCD. */
export function fieldsFor(c: Pick<Circuit, 'ring' | 'rcd_ma'>): Field[] {
  return [...(c.ring ? RING : []), ...ALL, ...(c.rcd_ma !== undefined ? RCD : []), NOTES];
}

/** What the form sends. */
export interface SessionInput {
  date: string;
  label: string;
  testedBy: string;
  /** circuit key (board/ref) → field → text as typed */
  values: Map<string, Partial<Record<ReadingField, string>>>;
}

export type SaveResult =
  | { ok: true; file: string }
  | {
    ok: false;
    /** `${board/ref}|${field}` → the message `check` gives for that cell */
    cells: Map<string, string>;
    /** problems of the session as a whole (its date, its label, nothing entered) */
    session: Map<'date' | 'label' | 'tested_by', string>;
    /** problems elsewhere in the job folder, located */
    job: LocatedError[];
  };

export const cellKey = (circuit: string, field: string): string => `${circuit}|${field}`;

const LABEL = /^[A-Za-z0-9][A-Za-z0-9_-]*$/;

function validDate(d: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(d)) return false;
  const t = new Date(`${d}T00:00:00Z`);
  return !Number.isNaN(t.getTime()) && t.toISOString().startsWith(d);
}

/**
 * The label of a new session on `date`: the wanted one (possibly none) if that file is free and
 * sorts after every session of that day (a later save must supersede an earlier one), else the
 * wanted label (or "session") numbered, else the day's last label numbered.
 */
export function newLabel(existing: readonly { date: string; label: string }[], date: string, wanted: string): string {
  const day = existing.filter((s) => s.date === date).map((s) => s.label);
  const fits = (l: string) => !day.includes(l) && day.every((e) => sessionOrder({ date, label: l }, { date, label: e }) > 0);
  if (fits(wanted)) return wanted;
  const last = [...day].sort((a, b) => sessionOrder({ date, label: a }, { date, label: b })).at(-1) ?? '';
  for (const base of [wanted || 'session', last]) {
    for (let n = 2; n < 100; n++) {
      const l = `${base}-${String(n).padStart(2, '0')}`;
      if (fits(l)) return l;
    }
  }
  throw new Error(`no free name for another session on ${date}`);
}

const csvCell = (s: string): string => `"${s.replace(/[\r\n]+/g, ' ').replace(/"/g, '""')}"`;

/** The CSV of a session: board, ref, the fields given, in the contract's column order. */
export function sessionCsv(input: SessionInput): { text: string; keys: string[] } {
  const rows = [...input.values].filter(([, v]) => Object.values(v).some((t) => t !== undefined && t.trim() !== ''));
  const used = READING_COLUMNS.filter((c) => c !== 'board' && c !== 'ref' && c !== 'tested_by'
    && rows.some(([, v]) => (v[c as ReadingField] ?? '').trim() !== '')) as ReadingField[];
  const testedBy = input.testedBy.trim();
  const header = ['board', 'ref', ...used, ...(testedBy ? ['tested_by'] : [])];
  const lines = [header.join(',')];
  const keys: string[] = [];
  for (const [key, v] of rows) {
    const slash = key.indexOf('/');
    const cells = [key.slice(0, slash), key.slice(slash + 1), ...used.map((f) => (v[f] ?? '').trim()), ...(testedBy ? [testedBy] : [])];
    lines.push(cells.map(csvCell).join(','));
    keys.push(key);
  }
  return { text: `${lines.join('\n')}\n`, keys };
}

/** Validate the session with the job's files and, if it and they are valid, write it as a new file. */
export function saveSession(jobDir: string, input: SessionInput): SaveResult {
  const cells = new Map<string, string>();
  const session = new Map<'date' | 'label' | 'tested_by', string>();
  const date = input.date.trim();
  const wanted = input.label.trim();
  if (!validDate(date)) session.set('date', `found "${date}"; expected the test date as YYYY-MM-DD`);
  if (wanted !== '' && !LABEL.test(wanted)) session.set('label', `found "${wanted}"; a label is letters, digits, "-" and "_", starting with a letter or digit`);
  const { text } = sessionCsv(input);
  const count = text.split('\n').length - 2;
  if (count === 0) session.set('tested_by', 'nothing entered: type at least one reading');
  if (session.size > 0) return { ok: false, cells, session, job: [] };

  const raw = readJob(jobDir);
  const label = newLabel(raw.sessions, date, wanted);
  const name = `${date}${label ? `-${label}` : ''}.csv`;
  const rel = `readings/${name}`;
  const { table, errors: csvErrors } = readCsv(rel, text);
  raw.errors.push(...csvErrors);
  raw.sessions = [...raw.sessions, { date, label, table }].sort(sessionOrder);
  const v = validate(raw, CALC_RULES, PROJECT_RULES, { today: today() });
  if (!v.ok) {
    const job: LocatedError[] = [];
    for (const e of v.errors) {
      const row = e.file === rel ? table.rows.find((r) => r.row === e.row) : undefined;
      const field = table.header.find((h) => h.column === e.column)?.text;
      if (row && field && row.cells.board && row.cells.ref) {
        const key = cellKey(circuitKey(row.cells.board.text, row.cells.ref.text), field);
        cells.set(key, cells.has(key) ? `${cells.get(key)}; ${e.message}` : e.message);
      } else job.push(e);
    }
    return { ok: false, cells, session, job };
  }
  const dir = join(jobDir, 'readings');
  mkdirSync(dir, { recursive: true });
  const temp = join(dir, workingName('session'));
  writeNew(temp, text);
  try {
    linkSync(temp, join(dir, name)); // fails if the file exists: a session is never replaced
  } finally {
    rmSync(temp, { force: true });
  }
  fsyncDir(dir);
  return { ok: true, file: rel };
}
