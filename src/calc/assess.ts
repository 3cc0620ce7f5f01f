// Project → Assessment. Pure: no file system, clock or network.
import type { Project } from '../model/validate.js';
import { circuitKey } from '../model/readings.js';
import { maxZs } from './devices/index.js';
import { CHECKS } from './checks/index.js';
import { stages, traced } from './history.js';
import { requiredDisconnection, resolveRules } from './rules.js';
import { STATUSES, type Assessment, type CircuitAssessment, type CircuitContext, type Summary } from './types.js';

const round = (n: number, places: number): number => Number(n.toFixed(places));

export function assess(project: Project): Assessment {
  const { file } = project;
  const rules = resolveRules(file.supply, file.rules);
  const circuits: CircuitAssessment[] = project.circuits.map((circuit) => {
    const board = file.boards.find((b) => b.id === circuit.board)!;
    const required = requiredDisconnection(file.supply.earthing, rules.u0_v, circuit.rating_a, rules, circuit.disconnect_s);
    const device = { code: circuit.device, rating_a: circuit.rating_a };
    const mz = maxZs(device, required.seconds, rules.u0_v, rules.cmin);
    const ctx: CircuitContext = {
      circuit,
      board,
      supply: file.supply,
      rules,
      readings: project.readings.get(circuitKey(circuit.board, circuit.ref)) ?? {},
      derived: {
        max_zs_ohm: mz ? round(mz.max_zs_ohm, 3) : null,
        required_disconnect_s: required.seconds,
      },
      maxZsBasis: mz
        ? `${circuit.device} ${circuit.rating_a} A at ${required.seconds} s: U0 ${rules.u0_v} V × Cmin ${rules.cmin} / ${mz.basis}; required time ${required.basis}`
        : `the device library has no characteristic for ${circuit.device} ${circuit.rating_a} A at ${required.seconds} s yet`,
    };
    const asOf = stages(ctx, project.rows);
    return {
      board: circuit.board,
      ref: circuit.ref,
      description: circuit.description,
      derived: ctx.derived,
      checks: CHECKS.map(([, check]) => traced(check, asOf)),
    };
  });
  return { job: project.name, rules, circuits, summary: summarise(circuits) };
}

export function summarise(circuits: CircuitAssessment[]): Summary {
  const summary = Object.fromEntries(STATUSES.map((s) => [s, 0])) as Summary;
  for (const c of circuits) for (const k of c.checks) summary[k.status] += 1;
  return summary;
}
