// Changes between two revisions' data.json: circuits added or removed, design data changed,
// readings changed (old → new, with their test dates), verdicts changed, job details changed.
import type { Changes } from '../render/view.js';
import { showReading } from '../render/values.js';
import { MEASURED, type MeasuredField } from '../model/schema.js';
import { circuitKey, type CircuitReadings } from '../model/readings.js';
import type { Reading } from '../model/units.js';
import type { PackData, RevisionInfo } from './data.js';

const JUDGED_OUTCOMES = ['polarity', 'rcd_button'] as const;

function shown(v: unknown): string {
  if (v === undefined || v === null || v === '') return '—';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  return String(v);
}

type Judged = MeasuredField | (typeof JUDGED_OUTCOMES)[number];

function showMeasured(field: Judged, m: CircuitReadings[Judged] | undefined): string {
  if (!m) return 'none';
  const value = field in MEASURED ? showReading(field as MeasuredField, m.value as Reading) : String(m.value);
  return `${value} on ${m.date}`;
}

/** Every leaf of a JSON value by its path, e.g. "supply.ze_ohm", "boards[1].location". */
function leaves(v: unknown, path: string, out: Map<string, string>): Map<string, string> {
  if (Array.isArray(v)) v.forEach((x, i) => leaves(x, `${path}[${i}]`, out));
  else if (v !== null && typeof v === 'object') for (const [k, x] of Object.entries(v)) leaves(x, path ? `${path}.${k}` : k, out);
  else out.set(path, shown(v));
  return out;
}

/** `prev` is an issued revision's data.json; `next` the data being rendered now. */
export function diffData(prev: PackData & { revision: RevisionInfo }, next: PackData, issued: Changes['issued']): Changes {
  const changes: Changes = {
    since: { revision: prev.revision.number, date: prev.revision.date },
    issued,
    circuitsAdded: [], circuitsRemoved: [], design: [], readings: [], verdicts: [], job: [], lateSessions: [],
  };
  const earlier = new Set(prev.sessions.map((s) => s.file));
  for (const s of next.sessions) {
    if (!earlier.has(s.file) && s.date <= prev.revision.date) changes.lateSessions.push({ file: s.file, date: s.date });
  }
  const before = new Map(prev.circuits.map((c) => [circuitKey(c.board, c.ref), c]));
  const after = new Set(next.circuits.map((c) => circuitKey(c.board, c.ref)));
  for (const c of prev.circuits) {
    if (!after.has(circuitKey(c.board, c.ref))) changes.circuitsRemoved.push({ board: c.board, ref: c.ref, description: c.description });
  }
  const prevChecks = new Map(prev.assessment.circuits.map((a) => [circuitKey(a.board, a.ref), a.checks]));
  const nextChecks = new Map(next.assessment.circuits.map((a) => [circuitKey(a.board, a.ref), a.checks]));
  for (const c of next.circuits) {
    const key = circuitKey(c.board, c.ref);
    const old = before.get(key);
    const at = { board: c.board, ref: c.ref };
    if (!old) {
      changes.circuitsAdded.push({ ...at, description: c.description });
      continue;
    }
    const was: Record<string, unknown> = { ...old };
    const now: Record<string, unknown> = { ...c };
    for (const f of [...new Set([...Object.keys(was), ...Object.keys(now)])].filter((k) => k !== 'row')) {
      const a = shown(was[f]);
      const b = shown(now[f]);
      if (a !== b) changes.design.push({ ...at, field: f, before: a, after: b });
    }
    const ra = prev.readings[key] ?? {};
    const rb = next.readings[key] ?? {};
    for (const f of [...(Object.keys(MEASURED) as MeasuredField[]), ...JUDGED_OUTCOMES]) {
      const a = ra[f];
      const b = rb[f];
      if (JSON.stringify([a?.value, a?.date]) !== JSON.stringify([b?.value, b?.date])) {
        changes.readings.push({ ...at, field: f, before: showMeasured(f, a), after: showMeasured(f, b) });
      }
    }
    const oldChecks = new Map((prevChecks.get(key) ?? []).map((k) => [k.id, k.status]));
    for (const k of nextChecks.get(key) ?? []) {
      const was = oldChecks.get(k.id);
      if (was !== undefined && was !== k.status) changes.verdicts.push({ ...at, check: k.id, before: was, after: k.status });
    }
  }
  const ja = leaves(prev.project, '', new Map());
  const jb = leaves(next.project, '', new Map());
  for (const path of [...new Set([...ja.keys(), ...jb.keys()])]) {
    const a = ja.get(path) ?? '—';
    const b = jb.get(path) ?? '—';
    if (a !== b) changes.job.push({ field: path, before: a, after: b });
  }
  if (prev.notes !== next.notes) {
    changes.job.push({ field: 'notes.md', before: prev.notes === null ? 'none' : 'earlier text', after: next.notes === null ? 'removed' : 'revised text (see Notes)' });
  }
  return changes;
}

/** The section of revision 1, which has nothing before it. */
export const firstIssue = (issued: Changes['issued']): Changes => ({
  since: null, issued, circuitsAdded: [], circuitsRemoved: [], design: [], readings: [], verdicts: [], job: [], lateSessions: [],
});
