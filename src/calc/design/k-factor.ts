// k for a protective conductor (IEC 60364-5-54 Annex A, formula A.1):
// k = √( Qc (β + 20) / ρ20 × ln(1 + (θf − θi) / (β + θi)) ).
import { K_TABULATED, MATERIAL_CONSTANTS, PROTECTIVE_TEMPS } from '../../reference/protective-conductor.js';
import type { Insulation, Material } from '../../reference/conductors.js';
import { withBasis } from '../basis.js';

/** the adiabatic equation holds for disconnection within 5 s (IEC 60364-5-54, 543.1.2) */
export const ADIABATIC_LIMIT_S = 5;

export function kFormula(material: Material, initialC: number, finalC: number): number {
  const { beta_c, qc, rho20 } = MATERIAL_CONSTANTS[material];
  return Math.sqrt(((qc * (beta_c + 20)) / rho20) * Math.log(1 + (finalC - initialC) / (beta_c + initialC)));
}

export interface KFactor {
  k: number;
  basis: string;
}

/** The tabulated k for a cpc that is a core of the cable or a separate insulated conductor. */
export function kFor(material: Material, insulation: Insulation, inCable: boolean): KFactor {
  const where = inCable ? 'core' : 'separate';
  const k = K_TABULATED[where][insulation][material];
  const t = PROTECTIVE_TEMPS[where][insulation];
  return withBasis({ k },
    () => `k ${k} (${material === 'cu' ? 'copper' : 'aluminium'}, ${insulation === 'pvc70' ? 'PVC' : 'XLPE'}, ${inCable ? 'core of the cable' : 'separate conductor'}, ${t.initial_c}→${t.final_c} °C; IEC 60364-5-54 Table ${inCable ? 'A.54.3' : 'A.54.2'})`);
}
