// Build a CircuitContext for a check from a few fields, the rest defaulted through the real
// schemas (so a test's circuit is exactly what circuits.csv would give).
import { BoardSchema, CircuitSchema, ReadingRowSchema, SupplySchema } from '../../src/model/schema.js';
import { mergeSessions, type SessionRow } from '../../src/model/readings.js';
import { resolveRules } from '../../src/calc/rules.js';
import { maxZs } from '../../src/calc/devices/index.js';
import { stages, type Stage } from '../../src/calc/history.js';
import type { CircuitContext, Derived } from '../../src/calc/types.js';

export interface Extra {
  /** derived values to set or override (e.g. r1r2_expected_ohm, which the design work fills in) */
  derived?: Partial<Derived>;
  /** board fields (e.g. zdb_ohm) */
  board?: Record<string, unknown>;
  /** rule-set overrides, as under rules: in project.yaml */
  rules?: Record<string, unknown>;
}

const row = (date: string, readings: Record<string, string>, n = 2): SessionRow => ({
  date, file: `readings/${date}.csv`, row: n, values: ReadingRowSchema.parse({ board: 'DB1', ref: '1', ...readings }),
});

function build(circuit: Record<string, string>, rows: SessionRow[], supply: Record<string, unknown>, required: number, extra: Extra): CircuitContext {
  const c = CircuitSchema.parse({
    board: 'DB1', ref: '1', description: 'test', kind: 'power', ib_a: '20', device: 'mcb:B', rating_a: '32',
    live_mm2: '2.5', cpc_mm2: '1.5', length_m: '20', method: 'C', ...circuit,
  });
  const s = SupplySchema.parse({ earthing: 'TN-C-S', ...supply });
  const rules = resolveRules(s, { set: 'iec-60364', ...extra.rules });
  const mz = maxZs({ code: c.device, rating_a: c.rating_a }, required, rules.u0_v, rules.cmin);
  return {
    circuit: { ...c, row: 2 },
    board: BoardSchema.parse({ id: 'DB1', ...extra.board }),
    supply: s,
    rules,
    readings: mergeSessions(rows).get('DB1/1') ?? {},
    derived: { max_zs_ohm: mz?.max_zs_ohm ?? null, required_disconnect_s: required, ...extra.derived } as Derived,
    maxZsBasis: mz?.basis ?? 'none',
  };
}

export function context(
  circuit: Record<string, string> = {},
  readings: Record<string, string> = {},
  supply: Record<string, unknown> = {},
  required = 0.4,
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
  return stages(build(circuit, rows, supply, 0.4, extra), rows);
}
