// Conductor resistance at any temperature: R(θ) = R20 × (1 + α20 (θ − 20)) (IEC 60287-1-1),
// from the IEC 60228 maximum resistance at 20 °C.
import { ALPHA20_PER_K, OPERATING_TEMP_C, R20_MOHM_PER_M, type Insulation, type Material } from '../../reference/conductors.js';

/** The IEC 60228 table by size as a number (2.5, not "2.5": a size is looked up at every trial length). */
const R20 = new Map(Object.entries(R20_MOHM_PER_M).map(([m, bySize]) => [m, new Map(Object.entries(bySize).map(([k, v]) => [Number(k), v]))]));

/** mΩ/m at θ °C, or null where IEC 60228 has no such size for the material */
export function resistance(material: Material, mm2: number, thetaC = 20): number | null {
  const r20 = R20.get(material)?.get(mm2);
  if (r20 === undefined) return null;
  return r20 * (1 + ALPHA20_PER_K[material] * (thetaC - 20));
}

export const operatingTemp = (insulation: Insulation): number => OPERATING_TEMP_C[insulation];

export function sizesOf(material: Material): number[] {
  return [...R20.get(material)!.keys()].sort((a, b) => a - b);
}
