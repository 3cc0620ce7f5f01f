// Source: IEC 60228:2004 Table 2 (class 1 and 2 plain conductors: maximum resistance at 20 °C, mΩ/m);
// temperature coefficients at 20 °C from IEC 60287-1-1 Table 1; maximum conductor operating
// temperatures from IEC 60364-5-52 Table 52.1 (PVC 70 °C, XLPE/EPR 90 °C).

export type Material = 'cu' | 'al';
export type Insulation = 'pvc70' | 'xlpe90';

/** maximum d.c. resistance at 20 °C, mΩ/m, by nominal cross-section (mm²) */
export const R20_MOHM_PER_M: Record<Material, Readonly<Record<number, number>>> = {
  cu: {
    1: 18.1, 1.5: 12.1, 2.5: 7.41, 4: 4.61, 6: 3.08, 10: 1.83, 16: 1.15, 25: 0.727, 35: 0.524, 50: 0.387,
    70: 0.268, 95: 0.193, 120: 0.153, 150: 0.124, 185: 0.0991, 240: 0.0754,
  },
  al: {
    10: 3.08, 16: 1.91, 25: 1.2, 35: 0.868, 50: 0.641, 70: 0.443, 95: 0.32, 120: 0.253, 150: 0.206,
    185: 0.164, 240: 0.125,
  },
};

/** temperature coefficient of resistance at 20 °C, per kelvin */
export const ALPHA20_PER_K: Record<Material, number> = { cu: 0.00393, al: 0.00403 };

/** maximum conductor temperature in normal operation, °C */
export const OPERATING_TEMP_C: Record<Insulation, number> = { pvc70: 70, xlpe90: 90 };
