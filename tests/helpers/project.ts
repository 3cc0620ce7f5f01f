// Build a validated Project in memory from a few fields, the rest defaulted through the real
// schemas (as project.yaml and circuits.csv would give them), for assess-level tests.
import { CircuitSchema, ProjectFileSchema, ReadingRowSchema } from '../../src/model/schema.js';
import { mergeSessions, type SessionRow } from '../../src/model/readings.js';
import type { Project } from '../../src/model/validate.js';

export const BASE_CIRCUIT = {
  board: 'DB1', description: 'test', kind: 'power', ib_a: '20', device: 'mcb:B', rating_a: '32',
  live_mm2: '2.5', cpc_mm2: '1.5', length_m: '20', method: 'C',
};

export function projectFile(over: Record<string, unknown> = {}) {
  return ProjectFileSchema.parse({
    title: 'Test', client: { name: 'C' }, site: { address: 'S' }, installer: { firm: 'F' },
    supply: { earthing: 'TN-C-S', ze_ohm: 0.35, pfc_ka: 1.5 },
    boards: [{ id: 'DB1' }],
    ...over,
  });
}

export function project(
  circuits: Record<string, string>[], over: Record<string, unknown> = {}, readings: Record<string, Record<string, string>> = {},
): Project {
  const cs = circuits.map((c, i) => ({ ...CircuitSchema.parse({ ...BASE_CIRCUIT, ref: String(i + 1), ...c }), row: i + 2 }));
  const rows: SessionRow[] = Object.entries(readings).map(([ref, r], i) => ({
    date: '2026-11-13', file: 'readings/2026-11-13.csv', row: i + 2, values: ReadingRowSchema.parse({ board: 'DB1', ref, ...r }),
  }));
  return { name: 'test', file: projectFile(over), circuits: cs, readings: mergeSessions(rows), rows, sessions: [], notes: null };
}
