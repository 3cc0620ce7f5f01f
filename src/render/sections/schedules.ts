// The board schedules: per board one row per circuit for the design (derived values) and one row
// per circuit for the test results, each cell a reading with the verdict of the check that judges
// it; re-tested cells carry a mark whose footnote gives the earlier values.
import type { CircuitRecord, Project } from '../../model/validate.js';
import type { Assessment, CircuitAssessment, CheckResult, Status } from '../../calc/types.js';
import { treeView } from './tree.js';
import { circuitKey, type CircuitReadings, type Measured } from '../../model/readings.js';
import type { MeasuredField } from '../../model/schema.js';
import { fmt, toSignificant } from '../../model/units.js';
import { TEST_CHECKS, READING_LABELS, lower } from '../labels.js';
import { look, worstStatus, type Look } from '../status.js';
import { bareReading, showReading } from '../values.js';

/** The values calc derives for each circuit (CONTRACT.md), in the schedule's order. */
export const DERIVED_FIELDS = [
  'iz_a', 'max_zs_ohm', 'zs_design_ohm', 'fault_current_a', 'disconnect_s', 'required_disconnect_s',
  'vd_percent', 'cpc_min_mm2', 'r1r2_expected_ohm', 'zdb_ohm', 'vd_origin_percent', 'max_length_m',
] as const;

type ResultField = MeasuredField | 'polarity' | 'rcd_button';

/** The columns of the results schedule, in order, and the checks that judge each. */
export const RESULT_COLUMNS: { field: ResultField; head: string; checks: string[] }[] = [
  { field: 'r1r2_ohm', head: 'R1+R2', checks: ['continuity', 'ring'] },
  { field: 'ring_r1_ohm', head: 'r1', checks: ['ring'] },
  { field: 'ring_rn_ohm', head: 'rn', checks: ['ring'] },
  { field: 'ring_r2_ohm', head: 'r2', checks: ['ring'] },
  { field: 'ir_ll_mohm', head: 'L–L', checks: ['insulation'] },
  { field: 'ir_le_mohm', head: 'L–E', checks: ['insulation'] },
  { field: 'ir_test_v', head: 'test V', checks: ['insulation'] },
  { field: 'polarity', head: 'Polarity', checks: ['polarity'] },
  { field: 'zs_ohm', head: 'Zs', checks: ['zs-measured', 'rcd-tt'] },
  { field: 'rcd_1x_ms', head: 'IΔn', checks: ['rcd'] },
  { field: 'rcd_5x_ms', head: '5 IΔn', checks: ['rcd'] },
  { field: 'rcd_button', head: 'Button', checks: ['rcd'] },
];

/** An id usable in a URL fragment and as a PDF destination. */
export const anchor = (...parts: string[]): string => parts.map((p) => p.replace(/[^A-Za-z0-9_-]+/g, '-')).join('-');

export const circuitAnchor = (c: { board: string; ref: string }): string => anchor('circuit', c.board, c.ref);

/** Who tested on a date: the tester of the session of that date, if written. */
function testerOn(readings: CircuitReadings, date: string): string | null {
  const t = readings.tested_by;
  if (!t) return null;
  if (t.date === date) return t.value;
  return t.earlier.find((e) => e.date === date)?.value ?? null;
}

const measuredOf = (readings: CircuitReadings, field: ResultField) => readings[field] as Measured<unknown> | undefined;
const showAny = (field: ResultField, v: unknown): string =>
  field === 'polarity' || field === 'rcd_button' ? String(v) : showReading(field, v as Parameters<typeof showReading>[1]);

export interface Footnote { mark: number; text: string }

function resultRow(c: CircuitRecord, a: CircuitAssessment, readings: CircuitReadings, notes: Footnote[]) {
  const checks = new Map<string, CheckResult>(a.checks.map((k) => [k.id, k]));
  let mark: number | null = null;
  const earlier = new Map<string, string[]>();
  /** the latest test date of the row (the greatest in the order sort() gives); set in the cells' callback, so typed here */
  let last = null as string | null;
  const cells = RESULT_COLUMNS.map(({ field, checks: judges }) => {
    const judged: Status[] = [];
    for (const id of judges) {
      const k = checks.get(id);
      if (k !== undefined) judged.push(k.status);
    }
    const status = judged.length ? worstStatus(judged) : null;
    const m = measuredOf(readings, field);
    if (!m) {
      // nothing recorded: blank where no check needs it, a dash with the verdict where one does
      const needed = status !== null && status !== 'n/a' && status !== 'pass';
      return { shown: needed ? '—' : '', look: needed ? look(status) : null, mark: null as number | null };
    }
    if (last === null || m.date > last) last = m.date;
    if (m.earlier.length) {
      mark ??= notes.length + 1;
      for (const e of m.earlier) earlier.set(e.date, [...(earlier.get(e.date) ?? []), `${lower(READING_LABELS[field]!.label)} ${showAny(field, e.value)}`]);
    }
    return {
      shown: bareReading(m.value as never),
      look: status === null ? null : look(status),
      mark: m.earlier.length ? mark : null,
    };
  });
  if (mark !== null) {
    const before = [...earlier.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([date, values]) => `on ${date}: ${values.join(', ')}`);
    notes.push({ mark, text: `${c.board} ${c.ref}, re-tested: the marked readings replace those taken ${before.join('; ')}.` });
  }
  return {
    ref: c.ref,
    description: c.description,
    anchor: circuitAnchor(c),
    cells,
    tested: last,
    by: last ? testerOn(readings, last) : null,
    look: look(worstOf(a.checks, true)),
  };
}

/** The worst status of a circuit's test checks (tests true) or of its design checks (tests false). */
function worstOf(checks: readonly CheckResult[], tests: boolean): Status {
  const statuses: Status[] = [];
  for (const k of checks) if (TEST_CHECKS.has(k.id) === tests) statuses.push(k.status);
  return worstStatus(statuses);
}

/** A length kept to three figures, rounded down (a longest run must never be shown longer than found). */
export function downTo3(m: number): number {
  if (m <= 0) return m;
  const step = 10 ** (Math.floor(Math.log10(m)) - 2);
  return toSignificant(Math.floor(m / step + 1e-9) * step, 3);
}

function designRow(c: CircuitRecord, a: CircuitAssessment) {
  const derived = {} as Record<(typeof DERIVED_FIELDS)[number], number | null>;
  for (const k of DERIVED_FIELDS) {
    const v = a.derived[k];
    derived[k] = typeof v === 'number' ? v : null;
  }
  if (derived.max_length_m !== null) derived.max_length_m = downTo3(derived.max_length_m);
  const ringWord = c.ring && !/\bring\b/i.test(c.description);
  return {
    ref: c.ref,
    description: c.description,
    anchor: circuitAnchor(c),
    kind: c.kind,
    device: c.device,
    rating_a: c.rating_a,
    cable: `${fmt(c.live_mm2)}/${fmt(c.cpc_mm2)} mm² ${c.conductor === 'cu' ? 'Cu' : 'Al'} ${c.insulation === 'pvc70' ? 'PVC' : 'XLPE'}`,
    method: c.method,
    length_m: c.length_m,
    ib_a: c.ib_a,
    ring: ringWord,
    rcd: c.rcd_ma === undefined ? null : `${fmt(c.rcd_ma)} mA${c.rcd_type ? ` type ${c.rcd_type}` : ''}`,
    derived,
    /** no length passes: the cell says "none" and the key below the table says why */
    noRun: derived.max_length_m === null && a.max_length_basis !== undefined,
    look: look(worstOf(a.checks, false)),
  };
}

/**
 * The circuits of each board, in the order of circuits.csv: grouped in one pass, where a filter of
 * every circuit for each board grows with boards × circuits (500 boards of a 20,000-circuit job:
 * ten million tests, a sixth of its render).
 */
export function circuitsByBoard(project: Pick<Project, 'circuits'>): (board: string) => CircuitRecord[] {
  const on = new Map<string, CircuitRecord[]>();
  for (const c of project.circuits) {
    const list = on.get(c.board);
    if (list) list.push(c);
    else on.set(c.board, [c]);
  }
  return (board) => on.get(board) ?? [];
}

export function boardSchedules(
  project: Project, byCircuit: Map<string, CircuitAssessment>, assessment: Pick<Assessment, 'boards'>, circuitsOn: (board: string) => CircuitRecord[],
) {
  return project.file.boards.map((b) => {
    const notes: Footnote[] = [];
    // each circuit with its assessment and readings, looked up once
    const circuits = circuitsOn(b.id).map((c) => {
      const key = circuitKey(c.board, c.ref);
      return { c, a: byCircuit.get(key)!, readings: project.readings.get(key) };
    });
    return {
      id: b.id,
      location: b.location ?? null,
      anchor: anchor('board', b.id),
      zdb_ohm: b.zdb_ohm ?? null,
      pfc_ka: b.pfc_ka ?? null,
      tree: treeView(b.id, assessment),
      circuits: circuits.map(({ c, a }) => designRow(c, a)),
      noRun: circuits.filter(({ a }) => a.derived.max_length_m === null).map(({ c }) => c),
      results: circuits.map(({ c, a, readings }) => resultRow(c, a, readings ?? {}, notes)),
      footnotes: notes,
    };
  });
}

export type ResultRow = ReturnType<typeof resultRow>;
export type { Look };
