// Voltage drop from conductor resistance at operating temperature (IEC 60364-5-52 Annex G):
// single-phase u = 2 × L × z × Ib, balanced three-phase u = √3 × L × z × Ib, as a percentage of
// U0 (single-phase) or of the line voltage √3 U0 (three-phase). z is the conductor resistance,
// with the Annex G reactance 0.08 mΩ/m added in quadrature from 25 mm² (a conservative power
// factor). A ring final circuit is taken with its load at the midpoint: a quarter of its length.
import type { Material } from '../../reference/conductors.js';
import { REACTANCE_FROM_MM2, REACTANCE_MOHM_PER_M } from '../../reference/voltage-drop.js';
import { fmt } from '../../model/units.js';
import { resistance } from './conductor.js';
import { withBasis } from '../basis.js';

export interface VoltageDrop {
  volts: number;
  percent: number;
  basis: string;
}

/** What a run's voltage drop needs but its length: the conductor's impedance per metre and the circuit's current and voltage. */
export interface DropInputs {
  material: Material; live_mm2: number; ib_a: number; phases: number; ring: boolean; theta_c: number; u0_v: number;
}

/** The drop's per-metre part (z, the multiplier and the reference voltage), or null where IEC 60228 has no such size. */
export interface DropPerMetre {
  opts: DropInputs;
  /** mΩ/m per conductor: resistance, reactance and both together */
  r: number;
  x: number;
  z: number;
  three: boolean;
  /** 2 single-phase, √3 three-phase */
  b: number;
  reference: number;
}

export function dropPerMetre(opts: DropInputs): DropPerMetre | null {
  const r = resistance(opts.material, opts.live_mm2, opts.theta_c);
  if (r === null) return null;
  const x = opts.live_mm2 >= REACTANCE_FROM_MM2 ? REACTANCE_MOHM_PER_M : 0;
  const z = Math.hypot(r, x); // mΩ/m per conductor
  const three = opts.phases === 3;
  return { opts, r, x, z, three, b: three ? Math.sqrt(3) : 2, reference: three ? Math.sqrt(3) * opts.u0_v : opts.u0_v };
}

/** The drop over a run of this length. */
export function dropOver(pm: DropPerMetre, lengthM: number): VoltageDrop {
  const { opts, r, x, z, three, b, reference } = pm;
  const length = opts.ring ? lengthM / 4 : lengthM;
  const volts = (b * length * z * opts.ib_a) / 1000;
  const percent = (100 * volts) / reference;
  return withBasis({ volts, percent }, () => {
    const zWords = x ? `√(${fmt(r)}² + ${x}²) mΩ/m` : `${fmt(r)} mΩ/m`;
    return `${three ? '√3' : '2'} × ${fmt(length)} m${opts.ring ? ' (ring: a quarter of its length)' : ''} × ${zWords} at ${opts.theta_c} °C × Ib ${fmt(opts.ib_a)} A`
      + ` = ${fmt(volts)} V = ${fmt(percent)} % of ${fmt(reference)} V`;
  });
}

export function voltageDrop(opts: DropInputs & { length_m: number }): VoltageDrop | null {
  const pm = dropPerMetre(opts);
  return pm && dropOver(pm, opts.length_m);
}
