// Build a CircuitContext for a check from a few fields, the rest defaulted through the real
// schemas (so a test's circuit is exactly what circuits.csv would give).
import { CircuitSchema, ReadingRowSchema, SupplySchema } from '../../src/model/schema.js';
import { mergeSessions } from '../../src/model/readings.js';
import { resolveRules } from '../../src/calc/rules.js';
import { maxZs } from '../../src/calc/devices/index.js';
import type { CircuitContext } from '../../src/calc/types.js';
import { design } from '../../src/calc/design/index.js';

export function context(
  circuit: Record<string, string> = {},
  readings: Record<string, string> = {},
  supply: Record<string, unknown> = {},
  required = 0.4,
): CircuitContext {
  const c = CircuitSchema.parse({
    board: 'DB1', ref: '1', description: 'test', kind: 'power', ib_a: '20', device: 'mcb:B', rating_a: '32',
    live_mm2: '2.5', cpc_mm2: '1.5', length_m: '20', method: 'C', ...circuit,
  });
  const s = SupplySchema.parse({ earthing: 'TN-C-S', ...supply });
  const rules = resolveRules(s, { set: 'iec-60364' });
  const row = ReadingRowSchema.parse({ board: 'DB1', ref: '1', ...readings });
  const merged = mergeSessions([{ date: '2026-11-13', file: 'readings/2026-11-13.csv', row: 2, values: row }]);
  const mz = maxZs({ code: c.device, rating_a: c.rating_a }, required, rules.u0_v, rules.cmin);
  return {
    circuit: { ...c, row: 2 },
    board: { id: 'DB1', zdb_ohm: undefined },
    supply: s,
    rules,
    readings: merged.get('DB1/1') ?? {},
    derived: { max_zs_ohm: mz?.max_zs_ohm ?? null, required_disconnect_s: required },
    design: design(c, { id: 'DB1' }, s, rules),
    maxZsBasis: mz?.basis ?? 'none',
  };
}
