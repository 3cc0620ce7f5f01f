// Source: IEC 60364-5-54:2011 Annex A — k for protective conductors: the formula's material
// constants (Table A.54.1), the initial and final temperatures, and the tabulated k
// (Table A.54.2: separate insulated conductor, initial 30 °C; Table A.54.3: core of a multicore
// cable, initial at the cable's operating temperature).

import type { Insulation, Material } from './conductors.js';

/** β (reciprocal of α at 0 °C, °C), Qc (volumetric heat capacity, J/(°C·mm³)), ρ20 (Ω·mm) */
export const MATERIAL_CONSTANTS: Record<Material, { beta_c: number; qc: number; rho20: number }> = {
  cu: { beta_c: 234.5, qc: 3.45e-3, rho20: 17.241e-6 },
  al: { beta_c: 228, qc: 2.5e-3, rho20: 28.264e-6 },
};

/** initial and final temperatures (°C) of the protective conductor */
export const PROTECTIVE_TEMPS: Record<'core' | 'separate', Record<Insulation, { initial_c: number; final_c: number }>> = {
  core: { pvc70: { initial_c: 70, final_c: 160 }, xlpe90: { initial_c: 90, final_c: 250 } },
  separate: { pvc70: { initial_c: 30, final_c: 160 }, xlpe90: { initial_c: 30, final_c: 250 } },
};

/** tabulated k, A·s½/mm² */
export const K_TABULATED: Record<'core' | 'separate', Record<Insulation, Record<Material, number>>> = {
  core: { pvc70: { cu: 115, al: 76 }, xlpe90: { cu: 143, al: 94 } },
  separate: { pvc70: { cu: 143, al: 95 }, xlpe90: { cu: 176, al: 116 } },
};
