// Project → Assessment. Pure: no file system, clock or network.
import type { Project } from '../model/validate.js';
import type { Board, Circuit, Supply } from '../model/schema.js';
import { circuitKey, type CircuitReadings } from '../model/readings.js';
import { significant, toPlaces } from '../model/units.js';
import { makerIa, maxZs, measuredFault } from './devices/index.js';
import { CHECKS } from './checks/index.js';
import { minimumFaultEnergy } from './checks/adiabatic.js';
import { design as designOf, type Design } from './design/index.js';
import { designFault, faultInputs, type DesignFault } from './design/fault.js';
import { TrialContext } from './trial-context.js';
import { kFor } from './design/k-factor.js';
import { breakingLevel } from './fault-level.js';
import { rowsByCircuit, stages, traced } from './history.js';
import { requiredDisconnection, resolveRules, type Rules } from './rules.js';
import { circuitDeparture, ruleDepartures, strictRules, type Departure } from './departures.js';
import { boardAsSeen, designSource, largestOnBoards, siteOf, type CircuitSite } from './tree/site.js';
import { originDrop } from './tree/origin.js';
import { carry } from './tree/carry.js';
import { fedBoards } from './tree/build.js';
import { boardQuery, type BoardQuery } from './tree/query.js';
import { longestRun, runWords, Trials } from './design/max-length.js';
import { remedy } from './remedy.js';
import { worst } from './checks/result.js';
import { STATUSES, type Assessment, type Check, type CheckResult, type CircuitAssessment, type CircuitContext, type Summary } from './types.js';

/**
 * The parts of a circuit's context that its length changes: the design table, the drop from the
 * origin and the design fault (`requiredS`: the time the circuit must meet, for a maker's Ia).
 */
function designed(circuit: Circuit, board: Board, supply: Supply, rules: Rules, site: CircuitSite | undefined, requiredS: number) {
  const design = designOf(circuit, board, supply, rules, site ? designSource(site.source) : undefined);
  return { design, vdOrigin: originDrop(design.vd, site?.source), fault: faultOf(circuit, design, supply, rules, requiredS) };
}

/** The design earth fault at the far end of the circuit as designed. */
function faultOf(circuit: Circuit, design: Design, supply: Supply, rules: Rules, requiredS: number): DesignFault {
  const { device, options } = faultInputs(circuit, supply, rules, requiredS);
  return designFault(design, device, options);
}

/** The circuit's context with another length (see trial-context.ts). */
export const atLength = (ctx: CircuitContext, lengthM: number): CircuitContext => new TrialContext(ctx).at(lengthM);

/** Everything the checks need to know about one circuit: its design table and its readings. */
export function circuitContext(
  circuit: Circuit & { row: number }, given: Board, supply: Supply, rules: Rules, readings: CircuitReadings, site?: CircuitSite,
): CircuitContext {
  const required = requiredDisconnection(supply.earthing, rules.u0_v, circuit, rules, site?.feeds?.board);
  const device = { code: circuit.device, rating_a: circuit.rating_a };
  const maker = makerIa(device, required.seconds, circuit.device_ia_a);
  const mz = maxZs(device, required.seconds, rules.u0_v, rules.cmin)
    ?? (maker ? { ia_a: maker.ia_a, max_zs_ohm: (rules.u0_v * rules.cmin) / maker.ia_a, basis: maker.basis } : null);
  const board = site ? boardAsSeen(given, site.source) : given;
  const { design, vdOrigin, fault } = designed(circuit, board, supply, rules, site, required.seconds);
  const pfcKa = board.pfc_ka ?? supply.pfc_ka;
  const level = breakingLevel(circuit, board, supply);
  const ctx: CircuitContext = {
    circuit,
    board,
    supply,
    rules,
    readings,
    derived: {
      iz_a: design.capacity.ok ? toPlaces(design.capacity.capacity.iz_a, 2) : null,
      max_zs_ohm: mz ? toPlaces(mz.max_zs_ohm, 3) : null,
      r1r2_expected_ohm: design.r1r2Cold ? toPlaces(design.r1r2Cold.ohm, 3) : null,
      zs_design_ohm: design.zs ? toPlaces(design.zs.ohm, 3) : null,
      vd_percent: design.vd ? toPlaces(design.vd.percent, 2) : null,
      cpc_min_mm2: null,
      required_disconnect_s: required.seconds,
      fault_current_max_a: level ? significant(level.amps) : null,
      zdb_ohm: design.source ? toPlaces(design.source.ohm, 3) : null,
      pfc_ka: pfcKa === undefined ? null : toPlaces(pfcKa, 3),
      vd_origin_percent: vdOrigin ? toPlaces(vdOrigin.percent, 2) : null,
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
    maxZsOhm: mz ? mz.max_zs_ohm : null,
    maxZsBasis: mz
      ? `${circuit.device} ${circuit.rating_a} A at ${required.seconds} s: U0 ${rules.u0_v} V × Cmin ${rules.cmin} / ${mz.basis}; required time ${required.basis}`
      : `the device library knows no current that operates ${circuit.device} ${circuit.rating_a} A within ${required.seconds} s, and circuits.csv gives no device_ia_a from its maker`,
  };
  const energy = minimumFaultEnergy(ctx);
  ctx.derived.cpc_min_mm2 = energy ? toPlaces(Math.sqrt(energy.i2t_a2s) / kFor(circuit.conductor, circuit.insulation, circuit.cpc_in_cable).k, 2) : null;
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
  // each rule-level departure with the circuits it bears on, as a set: a job of 20,000 circuits
  // would otherwise search a list of 20,000 for each of them
  const ruleLevel = departures.map((d) => ({ departure: d, on: new Set(d.circuits) }));
  const sources = carry(file.boards, project.circuits, file.supply, rules.u0_v);
  const fed = fedBoards(file.boards);
  const rowsOf = rowsByCircuit(project.rows);
  const boardById = new Map(file.boards.map((b) => [b.id, b]));
  const largest = largestOnBoards(project.circuits);
  const circuits: CircuitAssessment[] = project.circuits.map((circuit) => {
    const board = boardById.get(circuit.board)!;
    const readings = project.readings.get(circuitKey(circuit.board, circuit.ref)) ?? {};
    const site = siteOf(circuit, sources, fed, largest);
    const ctx = circuitContext(circuit, board, file.supply, rules, readings, site);
    const own = circuitDeparture(circuit, requiredDisconnection(file.supply.earthing, strict.u0_v, { ...circuit, disconnect_s: undefined }, strict, site.feeds?.board).seconds);
    if (own) departures.push(own);
    const key = `${circuit.board}/${circuit.ref}`;
    const bearing = [...ruleLevel.filter((r) => r.on.has(key)).map((r) => r.departure), ...(own ? [own] : [])];
    const strictCircuit = own ? { ...circuit, disconnect_s: undefined } : circuit;
    const strictCtx = bearing.length > 0 ? circuitContext(strictCircuit, board, file.supply, strict, readings, site) : ctx;
    // the longest run and what would pass are found under the rule set's own values
    const changed = (change: Partial<Circuit>) => circuitContext({ ...strictCircuit, ...change }, board, file.supply, strict, readings, site);
    const trials = new Trials(new TrialContext(strictCtx));
    const run = longestRun(trials, circuit.length_m);
    ctx.derived.max_length_m = run.length_m;
    const runBasis = runWords(run, trials, circuit.length_m)
      + (site.feeds ? ` (its own checks only: a longer run also raises Zdb and the drop at ${site.feeds.board}, whose circuits are not judged again here)` : '');
    const asOf = stages(ctx, rowsOf.get(circuitKey(circuit.board, circuit.ref)) ?? []);
    const query = site.feeds ? boardQuery(site.feeds.source, site.source, rules) : null;
    return {
      board: circuit.board,
      ref: circuit.ref,
      description: circuit.description,
      derived: ctx.derived,
      max_length_basis: runBasis,
      checks: CHECKS.map(([id, check]): CheckResult => {
        const r = traced(withoutDepartures(check, strictCtx, bearing), asOf);
        // what would pass is shown only on a failure, so it is looked for only there
        const fix = r.status === 'fail' && REMEDIED.has(id) ? remedy(id, check, strictCtx, changed, trials) : null;
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
  return { job: project.name, rules, boards: [...sources.values()], circuits, summary: summarise(circuits), departures };
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
