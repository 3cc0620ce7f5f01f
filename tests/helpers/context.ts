// Build a CircuitContext for a check from a few fields, the rest defaulted through the real
// schemas (so a test's circuit is exactly what circuits.csv would give).
import { BoardSchema, CircuitSchema, ReadingRowSchema, RulesSchema, SupplySchema } from '../../src/model/schema.js';
import { mergeSessions, type SessionRow } from '../../src/model/readings.js';
import { resolveRules } from '../../src/calc/rules.js';
import { circuitContext } from '../../src/calc/assess.js';
import { stages, type Stage } from '../../src/calc/history.js';
import type { CircuitContext, Derived } from '../../src/calc/types.js';

export interface Extra {
  /** derived values to set or override (e.g. r1r2_expected_ohm, which the design work fills in) */
  derived?: Partial<Derived>;
  /** board fields (e.g. zdb_ohm) */
  board?: Record<string, unknown>;
  /** rule-set overrides, as under rules: in project.yaml */
  rules?: Record<string, unknown>;
  /** project.yaml premises (default dwelling) */
  premises?: 'dwelling' | 'other';
}

const row = (date: string, readings: Record<string, string>, n = 2): SessionRow => ({
  date, file: `readings/${date}.csv`, row: n, values: ReadingRowSchema.parse({ board: 'DB1', ref: '1', ...readings }),
});

function build(circuit: Record<string, string>, rows: SessionRow[], supply: Record<string, unknown>, required: number | undefined, extra: Extra): CircuitContext {
  const c = CircuitSchema.parse({
    board: 'DB1', ref: '1', description: 'test', kind: 'power', ib_a: '20', device: 'mcb:B', rating_a: '32',
    live_mm2: '2.5', cpc_mm2: '1.5', length_m: '20', method: 'C', ...(required === undefined ? {} : { disconnect_s: String(required) }), ...circuit,
  });
  const s = SupplySchema.parse({ earthing: 'TN-C-S', ...supply });
  const rules = resolveRules(s, RulesSchema.parse({ set: 'iec-60364', ...extra.rules }), extra.premises ?? 'dwelling');
  const ctx = circuitContext({ ...c, row: 2 }, BoardSchema.parse({ id: 'DB1', ...extra.board }), s, rules, mergeSessions(rows).get('DB1/1') ?? {});
  return { ...ctx, derived: { ...ctx.derived, ...extra.derived } as Derived };
}

export function context(
  circuit: Record<string, string> = {},
  readings: Record<string, string> = {},
  supply: Record<string, unknown> = {},
  /** the required disconnection time; default the rule set's */
  required?: number,
  extra: Extra = {},
): CircuitContext {
  return build(circuit, [row('2026-11-13', readings)], supply, required, extra);
}

/** The circuit as of each of several test sessions (oldest first), as assess builds it. */
export function sessions(
  circuit: Record<string, string>,
  tests: { date: string; readings: Record<string, string> }[],
  supply: Record<string, unknown> = {},
  extra: Extra = {},
): Stage[] {
  const rows = tests.map((t, i) => row(t.date, t.readings, i + 2));
  return stages(build(circuit, rows, supply, undefined, extra), rows);
}
