// R1+R2 of a circuit from its length and conductor sizes, and the design earth fault loop
// impedance Zs = Ze (or the board's measured Zdb) + R1+R2. A ring final circuit's R1+R2 at a
// point midway round the ring is (r1 + r2)/4, r1 and r2 the end-to-end resistances of the ring.
import type { Material } from '../../reference/conductors.js';
import { fmt } from '../../model/units.js';
import { resistance } from './conductor.js';
import { withBasis } from '../basis.js';

export interface R1R2 {
  ohm: number;
  theta_c: number;
  basis: string;
}

/** The resistances per metre (mΩ/m) of the live conductor and the cpc at one temperature: what a length multiplies. */
export interface PerMetre {
  r1: number;
  r2: number;
  /** r1 + r2 */
  sum: number;
}

/** r1, r2 and their sum at θ °C, or null where IEC 60228 has no such size. Worked once for a circuit tried at many lengths. */
export function perMetre(material: Material, liveMm2: number, cpcMm2: number, thetaC: number): PerMetre | null {
  const r1 = resistance(material, liveMm2, thetaC);
  const r2 = resistance(material, cpcMm2, thetaC);
  if (r1 === null || r2 === null) return null;
  return { r1, r2, sum: r1 + r2 };
}

/** R1+R2 of a run of this length, from the resistances per metre. */
export function r1r2Of(pm: PerMetre, lengthM: number, ring: boolean, thetaC: number): R1R2 {
  const { r1, r2, sum } = pm;
  const ohm = (sum * lengthM) / 1000 / (ring ? 4 : 1);
  return withBasis({ ohm, theta_c: thetaC }, () => (ring
    ? `R1+R2 = (r1 + r2)/4 = ${fmt(lengthM)} m × ${fmt(sum)} mΩ/m / 4 = ${fmt(ohm)} Ω at ${thetaC} °C (ring)`
    : `R1+R2 = ${fmt(lengthM)} m × (${fmt(r1)} + ${fmt(r2)}) mΩ/m = ${fmt(ohm)} Ω at ${thetaC} °C`));
}

export function r1r2(material: Material, liveMm2: number, cpcMm2: number, lengthM: number, ring: boolean, thetaC: number): R1R2 | null {
  const pm = perMetre(material, liveMm2, cpcMm2, thetaC);
  return pm && r1r2Of(pm, lengthM, ring, thetaC);
}

export interface SourceImpedance {
  ohm: number;
  words: string;
}

/** The loop impedance up to the board: the board's measured Zdb, else the supply's Ze. */
export function sourceImpedance(zdb: number | undefined, ze: number | undefined, boardId: string): SourceImpedance | null {
  if (zdb !== undefined) return { ohm: zdb, words: `Zdb ${fmt(zdb)} Ω measured at ${boardId}` };
  if (ze !== undefined) return { ohm: ze, words: `Ze ${fmt(ze)} Ω (no Zdb given for ${boardId}: taken as at the origin)` };
  return null;
}
