// Project → Assessment. Pure: no file system, clock or network.
import type { Project } from '../model/validate.js';
import type { Board, Circuit, Supply } from '../model/schema.js';
import { circuitKey, type CircuitReadings } from '../model/readings.js';
import { significant } from '../model/units.js';
import { maxZs, measuredFault } from './devices/index.js';
import { CHECKS } from './checks/index.js';
import { design as designOf } from './design/index.js';
import { designFault } from './design/fault.js';
import { ADIABATIC_LIMIT_S, kFor } from './design/k-factor.js';
import { stages, traced } from './history.js';
import { requiredDisconnection, resolveRules, type Rules } from './rules.js';
import { boardAsSeen, designSource, siteOf, type CircuitSite } from './tree/site.js';
import { originDrop } from './tree/origin.js';
import { carry } from './tree/carry.js';
import { fedBoards } from './tree/build.js';
import { boardQuery, type BoardQuery } from './tree/query.js';
import { longestRun } from './design/max-length.js';
import { remedy } from './remedy.js';
import { worst } from './checks/result.js';
import { STATUSES, type CheckResult, type Assessment, type CircuitAssessment, type CircuitContext, type Summary } from './types.js';

const round = (n: number, places: number): number => Number(n.toFixed(places));

/** The parts of a circuit's context that its length changes: design table, drop from the origin, design fault. */
function designed(circuit: Circuit, board: Board, supply: Supply, rules: Rules, site: CircuitSite | undefined) {
  const device = { code: circuit.device, rating_a: circuit.rating_a };
  const design = designOf(circuit, board, supply, rules, site ? designSource(site.source) : undefined);
  const vdOrigin = originDrop(design.vd, site?.source);
  const rcd = supply.earthing === 'TT' && circuit.rcd_ma !== undefined ? { ma: circuit.rcd_ma, type: circuit.rcd_type } : null;
  const fault = designFault(design, device, { u0: rules.u0_v, cmin: rules.cmin, rcd });
  return { design, vdOrigin, fault };
}

/**
 * The circuit's context with another length: only what the length changes is worked again (the
 * required time and max Zs do not depend on it). For the longest run and what would pass.
 */
export function atLength(ctx: CircuitContext, lengthM: number): CircuitContext {
  const circuit = { ...ctx.circuit, length_m: lengthM };
  return { ...ctx, circuit, ...designed(circuit, ctx.board, ctx.supply, ctx.rules, ctx.site) };
}

/** Everything the checks need to know about one circuit: its design table and its readings. */
export function circuitContext(
  circuit: Circuit & { row: number }, given: Board, supply: Supply, rules: Rules, readings: CircuitReadings, site?: CircuitSite,
): CircuitContext {
  const required = requiredDisconnection(supply.earthing, rules.u0_v, circuit.rating_a, rules, circuit.disconnect_s, site?.feeds?.board);
  const device = { code: circuit.device, rating_a: circuit.rating_a };
  const mz = maxZs(device, required.seconds, rules.u0_v, rules.cmin);
  const board = site ? boardAsSeen(given, site.source) : given;
  const { design, vdOrigin, fault } = designed(circuit, board, supply, rules, site);
  const pfcKa = board.pfc_ka ?? supply.pfc_ka;
  const energy = fault.known && fault.time_s !== null && fault.time_s <= ADIABATIC_LIMIT_S ? fault.energy : null;
  const cpcMin = energy ? Math.sqrt(energy.i2t_a2s) / kFor(circuit.conductor, circuit.insulation, circuit.cpc_in_cable).k : null;
  return {
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
      cpc_min_mm2: cpcMin === null ? null : round(cpcMin, 2),
      required_disconnect_s: required.seconds,
      zdb_ohm: design.source ? round(design.source.ohm, 3) : null,
      pfc_ka: pfcKa === undefined ? null : round(pfcKa, 3),
      fault_current_max_a: pfcKa === undefined ? null : significant(pfcKa * 1000),
      vd_origin_percent: vdOrigin ? round(vdOrigin.percent, 2) : null,
      // the design fault where a design Zs is known, else the one a measured Zs gives
      ...(fault.known
        ? { fault_current_a: significant(fault.current_a), disconnect_s: fault.time_s === null ? null : significant(fault.time_s) }
        : measuredFault(device, readings.zs_ohm?.value, rules.u0_v, rules.cmin)),
    },
    design,
    fault,
    ...(site ? { site } : {}),
    vdOrigin,
    requiredBasis: required.basis,
    maxZsBasis: mz
      ? `${circuit.device} ${circuit.rating_a} A at ${required.seconds} s: U0 ${rules.u0_v} V × Cmin ${rules.cmin} / ${mz.basis}; required time ${required.basis}`
      : `the device library knows no current that operates ${circuit.device} ${circuit.rating_a} A within ${required.seconds} s`,
  };
}

export function assess(project: Project): Assessment {
  const { file } = project;
  const rules = resolveRules(file.supply, file.rules);
  const sources = carry(file.boards, project.circuits, file.supply, rules.u0_v);
  const fed = fedBoards(file.boards);
  const circuits: CircuitAssessment[] = project.circuits.map((circuit) => {
    const board = file.boards.find((b) => b.id === circuit.board)!;
    const readings = project.readings.get(circuitKey(circuit.board, circuit.ref)) ?? {};
    const site = siteOf(circuit, sources, fed, project.circuits);
    const changed = (change: Partial<Circuit>) => circuitContext({ ...circuit, ...change }, board, file.supply, rules, readings, site);
    const ctx = circuitContext(circuit, board, file.supply, rules, readings, site);
    const run = longestRun((l) => atLength(ctx, l), circuit.length_m);
    ctx.derived.max_length_m = run.length_m;
    const asOf = stages(ctx, project.rows);
    const query = site.feeds ? boardQuery(site.feeds.source, site.source, rules) : null;
    return {
      board: circuit.board,
      ref: circuit.ref,
      description: circuit.description,
      derived: ctx.derived,
      checks: CHECKS.map(([id, check]) => {
        const r = traced(check, asOf);
        const fix = REMEDIED.has(id) ? remedy(id, check, ctx, changed, (l) => atLength(ctx, l)) : null;
        const withFix = fix ? { ...r, remedy: fix } : r;
        return id === 'zs-measured' && query ? withQuery(withFix, query) : withFix;
      }),
      ...(site.feeds ? {
        feeds: {
          board: site.feeds.board,
          largest: site.feeds.largest,
          fault_current_a: site.feeds.source.pfc.used === null ? null : significant(site.feeds.source.pfc.used * 1000),
        },
      } : {}),
    };
  });
  return { job: project.name, rules, boards: [...sources.values()], circuits, summary: summarise(circuits) };
}

/** The failing design checks that say what would pass. */
const REMEDIED: ReadonlySet<string> = new Set(['overload', 'voltage-drop', 'zs-design', 'disconnection', 'adiabatic', 'cpc-size']);

/** A feeding circuit's measured Zs check also answers for the values measured at the board it feeds. */
function withQuery(r: CheckResult, q: BoardQuery): CheckResult {
  return { ...r, status: worst([r.status, q.status]), basis: `${r.basis}; at the far end, ${q.basis}` };
}

export function summarise(circuits: CircuitAssessment[]): Summary {
  const summary = Object.fromEntries(STATUSES.map((s) => [s, 0])) as Summary;
  for (const c of circuits) for (const k of c.checks) summary[k.status] += 1;
  return summary;
}
