// Re-tests: a check judged as of each test session, so the pack can say "Zs 1.62 Ω on 2026-11-13
// (fail), re-tested 0.71 Ω on 2026-11-20 (pass)". Pure: given the circuit as of each session.
import { circuitKey, mergeSessions, type SessionRow } from '../model/readings.js';
import type { Check, CheckResult, CircuitContext, HistoryEntry } from './types.js';

export interface Stage {
  /** the date of the session this stage ends with */
  date: string;
  ctx: CircuitContext;
}

/**
 * A job's reading rows by circuit, each circuit's in session order. `stages` is asked once per
 * circuit: given only that circuit's rows, it does not search every row of the job for them
 * (which grew with the square of the circuits: 0.9 s of a 4,000-circuit job's assessment).
 */
export function rowsByCircuit(rows: readonly SessionRow[]): Map<string, SessionRow[]> {
  const by = new Map<string, SessionRow[]>();
  for (const r of rows) {
    const key = circuitKey(r.values.board, r.values.ref);
    const own = by.get(key);
    if (own) own.push(r);
    else by.set(key, [r]);
  }
  return by;
}

/**
 * The circuit as of each session that tested it, oldest first: sessions merged up to and
 * including that one. `ctx` is the circuit with every session; its readings are the last stage's.
 * `rows` may be the job's rows or only this circuit's (rowsByCircuit): the others are passed over.
 */
export function stages(ctx: CircuitContext, rows: readonly SessionRow[]): Stage[] {
  const key = circuitKey(ctx.circuit.board, ctx.circuit.ref);
  const own = rows.filter((r) => circuitKey(r.values.board, r.values.ref) === key);
  const earlier = own.slice(0, -1).map((r, i) => ({
    date: r.date,
    ctx: { ...ctx, readings: mergeSessions(own.slice(0, i + 1)).get(key) ?? {} },
  }));
  return [...earlier, { date: own.at(-1)?.date ?? '', ctx }];
}

/**
 * The check as of the last stage, with its history where a later session changed its verdict,
 * value or the date of the reading judged. Stages before the check had a reading to judge are
 * left out of the history.
 */
export function traced(check: Check, all: readonly Stage[]): CheckResult {
  // judged once (nearly every circuit: tested in one session), it has no history to trace
  if (all.length === 1) return check(all[0]!.ctx);
  const results = all.map((s) => ({ stage: s, r: check(s.ctx) }));
  const current = results.at(-1)!.r;
  const same = (a: CheckResult, b: CheckResult) =>
    a.date === b.date && a.value === b.value && a.over_range === b.over_range && a.status === b.status;
  const kept: { entry: HistoryEntry; r: CheckResult }[] = [];
  for (const { stage, r } of results) {
    const last = kept.at(-1);
    if (last && same(last.r, r)) continue;
    if (!last && r.date === undefined) continue;
    const entry: HistoryEntry = { date: r.date ?? stage.date, value: r.value, status: r.status };
    if (r.over_range) entry.over_range = true;
    kept.push({ entry, r });
  }
  if (kept.length < 2) return current;
  return { ...current, history: kept.map((k) => k.entry) };
}
