// Project → Assessment. Pure: no file system, clock or network.
import type { Project } from '../model/validate.js';
import type { Board, Circuit, Supply } from '../model/schema.js';
import { circuitKey, type CircuitReadings } from '../model/readings.js';
import { significant } from '../model/units.js';
import { makerIa, maxZs, measuredFault } from './devices/index.js';
import { CHECKS } from './checks/index.js';
import { minimumFaultEnergy } from './checks/adiabatic.js';
import { design as designOf } from './design/index.js';
import { designFault } from './design/fault.js';
import { kFor } from './design/k-factor.js';
import { breakingLevel } from './fault-level.js';
import { stages, traced } from './history.js';
import { requiredDisconnection, resolveRules, type Rules } from './rules.js';
import { circuitDeparture, ruleDepartures, strictRules, type Departure } from './departures.js';
import { STATUSES, type Assessment, type Check, type CheckResult, type CircuitAssessment, type CircuitContext, type Summary } from './types.js';

const round = (n: number, places: number): number => Number(n.toFixed(places));

/** Everything the checks need to know about one circuit: its design table and its readings. */
export function circuitContext(
  circuit: Circuit & { row: number }, board: Board, supply: Supply, rules: Rules, readings: CircuitReadings,
): CircuitContext {
  const required = requiredDisconnection(supply.earthing, rules.u0_v, circuit, rules);
  const device = { code: circuit.device, rating_a: circuit.rating_a };
  const maker = makerIa(device, required.seconds, circuit.device_ia_a);
  const mz = maxZs(device, required.seconds, rules.u0_v, rules.cmin)
    ?? (maker ? { ia_a: maker.ia_a, max_zs_ohm: (rules.u0_v * rules.cmin) / maker.ia_a, basis: maker.basis } : null);
  const design = designOf(circuit, board, supply, rules);
  const rcd = supply.earthing === 'TT' && circuit.rcd_ma !== undefined ? { ma: circuit.rcd_ma, type: circuit.rcd_type } : null;
  const fault = designFault(design, device, { u0: rules.u0_v, cmin: rules.cmin, rcd, maker: maker ? { ...maker, required_s: required.seconds } : null });
  const level = breakingLevel(circuit, board, supply);
  const ctx: CircuitContext = {
    circuit,
    board,
    supply,
    rules,
    readings,
    derived: {
      iz_a: design.capacity.ok ? round(design.capacity.capacity.iz_a, 2) : null,
      max_zs_ohm: mz ? round(mz.max_zs_ohm, 3) : null,
      r1r2_expected_ohm: design.r1r2Cold ? round(design.r1r2Cold.ohm, 3) : null,
      zs_design_ohm: design.zs ? round(design.zs.ohm, 3) : null,
      vd_percent: design.vd ? round(design.vd.percent, 2) : null,
      cpc_min_mm2: null,
      required_disconnect_s: required.seconds,
      fault_current_max_a: level ? significant(level.amps) : null,
      // the design fault where a design Zs is known, else the one a measured Zs gives
      ...(fault.known
        ? { fault_current_a: significant(fault.current_a), disconnect_s: fault.time_s === null ? null : significant(fault.time_s) }
        : measuredFault(device, readings.zs_ohm?.value, rules.u0_v, rules.cmin)),
    },
    design,
    fault,
    requiredBasis: required.basis,
    maxZsBasis: mz
      ? `${circuit.device} ${circuit.rating_a} A at ${required.seconds} s: U0 ${rules.u0_v} V × Cmin ${rules.cmin} / ${mz.basis}; required time ${required.basis}`
      : `the device library knows no current that operates ${circuit.device} ${circuit.rating_a} A within ${required.seconds} s, and circuits.csv gives no device_ia_a from its maker`,
  };
  const energy = minimumFaultEnergy(ctx);
  ctx.derived.cpc_min_mm2 = energy ? round(Math.sqrt(energy.i2t_a2s) / kFor(circuit.conductor, circuit.insulation, circuit.cpc_in_cable).k, 2) : null;
  return ctx;
}

/**
 * A check under departures: where it passes only because of a rule value less strict than the
 * set's own (it does not pass under the strict rules), it is `attention`, saying so.
 */
export function withoutDepartures(check: Check, strict: CircuitContext, departures: readonly Departure[]): Check {
  return (ctx) => {
    const r = check(ctx);
    if (r.status !== 'pass' || departures.length === 0) return r;
    const s = check({ ...strict, readings: ctx.readings });
    if (s.status === 'pass') return r;
    return { ...r, status: 'attention', basis: `${r.basis}; passes only by a departure (${departures.map((d) => d.basis).join('; ')}): under the rule set's own values it is ${s.status} (${s.basis})` };
  };
}

export function assess(project: Project): Assessment {
  const { file } = project;
  const rules = resolveRules(file.supply, file.rules, file.premises);
  const strict = strictRules(rules);
  const departures = ruleDepartures(rules, project.circuits);
  const circuits: CircuitAssessment[] = project.circuits.map((circuit) => {
    const board = file.boards.find((b) => b.id === circuit.board)!;
    const readings = project.readings.get(circuitKey(circuit.board, circuit.ref)) ?? {};
    const ctx = circuitContext(circuit, board, file.supply, rules, readings);
    const own = circuitDeparture(circuit, requiredDisconnection(file.supply.earthing, strict.u0_v, { ...circuit, disconnect_s: undefined }, strict).seconds);
    if (own) departures.push(own);
    const bearing = [...departures.filter((d) => d.rule !== 'disconnect_s' && d.circuits.includes(`${circuit.board}/${circuit.ref}`)), ...(own ? [own] : [])];
    const strictCircuit = own ? { ...circuit, disconnect_s: undefined } : circuit;
    const strictCtx = bearing.length > 0 ? circuitContext(strictCircuit, board, file.supply, strict, readings) : ctx;
    const asOf = stages(ctx, project.rows);
    return {
      board: circuit.board,
      ref: circuit.ref,
      description: circuit.description,
      derived: ctx.derived,
      checks: CHECKS.map(([, check]): CheckResult => traced(withoutDepartures(check, strictCtx, bearing), asOf)),
    };
  });
  return { job: project.name, rules, circuits, summary: summarise(circuits), departures };
}

export function summarise(circuits: CircuitAssessment[]): Summary {
  const summary = Object.fromEntries(STATUSES.map((s) => [s, 0])) as Summary;
  for (const c of circuits) for (const k of c.checks) summary[k.status] += 1;
  return summary;
}
