// A circuit's design table, as a designer would fill it in by hand: Iz, R1+R2 (at operating
// temperature and at 20 °C), design Zs and voltage drop, each with the numbers behind it.
import type { Board, Circuit, Supply } from '../../model/schema.js';
import type { Rules } from '../rules.js';
import { fmt } from '../../model/units.js';
import { capacityOf, type CapacityResult } from './capacity.js';
import { operatingTemp } from './conductor.js';
import { perMetre, r1r2Of, sourceImpedance, type PerMetre, type R1R2, type SourceImpedance } from './impedance.js';
import { dropOver, dropPerMetre, type DropPerMetre, type VoltageDrop } from './voltage-drop.js';
import { withBasis } from '../basis.js';

export interface Design {
  capacity: CapacityResult;
  /** R1+R2 at the insulation's maximum operating temperature */
  r1r2Hot: R1R2 | null;
  /** R1+R2 at 20 °C: what a continuity test should find */
  r1r2Cold: R1R2 | null;
  source: SourceImpedance | null;
  zs: { ohm: number; basis: string } | null;
  vd: VoltageDrop | null;
  vdLimit: { percent: number; basis: string };
}

/** `given`: the loop impedance up to the board as the tree of boards found it (else the board's Zdb or Ze). */
export function design(circuit: Circuit, board: Board, supply: Supply, rules: Rules, given?: SourceImpedance | null): Design {
  const lighting = circuit.kind === 'lighting';
  const limit = lighting ? rules.vd_lighting_percent : rules.vd_other_percent;
  return lengthDesign(circuit, rules, {
    capacity: capacityOf(circuit),
    source: given !== undefined ? given : sourceImpedance(board.zdb_ohm, supply.ze_ohm, board.id),
    vdLimit: { percent: limit, basis: `${limit} % for ${lighting ? 'lighting' : 'other uses'} (IEC 60364-5-52 Table G.52.1${rules.overrides.includes(lighting ? 'vd_lighting_percent' : 'vd_other_percent') ? ', overridden for this job' : ''})` },
  });
}

/** What the circuit's length does not change: kept from the circuit's own design when only the length is tried. */
export type LengthFree = Pick<Design, 'capacity' | 'source' | 'vdLimit'>;

/** A circuit's design with its length left open: the length-free parts and everything per metre. */
export interface PerMetreDesign {
  base: LengthFree;
  theta_c: number;
  ring: boolean;
  hot: PerMetre | null;
  cold: PerMetre | null;
  drop: DropPerMetre | null;
}

/** Worked once for a circuit tried at many lengths: the resistances per metre at both temperatures and the drop per metre. */
export function perMetreDesign(circuit: Circuit, rules: Rules, base: LengthFree): PerMetreDesign {
  const theta = operatingTemp(circuit.insulation);
  return {
    base,
    theta_c: theta,
    ring: circuit.ring,
    hot: perMetre(circuit.conductor, circuit.live_mm2, circuit.cpc_mm2, theta),
    cold: perMetre(circuit.conductor, circuit.live_mm2, circuit.cpc_mm2, 20),
    drop: dropPerMetre({
      material: circuit.conductor, live_mm2: circuit.live_mm2, ib_a: circuit.ib_a,
      phases: circuit.phases, ring: circuit.ring, theta_c: theta, u0_v: rules.u0_v,
    }),
  };
}

/** The design at one length. */
export function designAt(pm: PerMetreDesign, lengthM: number): Design {
  const hot = pm.hot && r1r2Of(pm.hot, lengthM, pm.ring, pm.theta_c);
  const cold = pm.cold && r1r2Of(pm.cold, lengthM, pm.ring, 20);
  const { source } = pm.base;
  const zs = hot && source ? withBasis({ ohm: source.ohm + hot.ohm }, () => `Zs = ${source.words} + ${hot.basis} = ${fmt(source.ohm + hot.ohm)} Ω`) : null;
  return {
    capacity: pm.base.capacity,
    r1r2Hot: hot,
    r1r2Cold: cold,
    source,
    zs,
    vd: pm.drop && dropOver(pm.drop, lengthM),
    vdLimit: pm.base.vdLimit,
  };
}

/** The design of a circuit whose parts that do not depend on its length are already known (`base`, for this circuit at any length). */
export function lengthDesign(circuit: Circuit, rules: Rules, base: LengthFree): Design {
  return designAt(perMetreDesign(circuit, rules, base), circuit.length_m);
}
