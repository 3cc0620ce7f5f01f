// Source: IEC 60364-5-52:2009 Annex B — Table B.52.14 (ambient air temperature other than 30 °C),
// Table B.52.15 (ground temperature other than 20 °C, from memory), Table B.52.17 row 1 (grouping:
// bunched in air, on a surface, embedded or enclosed); BS 7671:2018 Table 52.2 (cable in thermal
// insulation: derating for a length of contact up to 400 mm) and 523.9 (totally surrounded for more
// than 0.5 m: factor 0.5).

/** ambient air temperature (°C) → factor, 10–60 °C in 5 °C steps */
export const AMBIENT_AIR: Record<'pvc70' | 'xlpe90', Readonly<Record<number, number>>> = {
  pvc70: { 10: 1.22, 15: 1.17, 20: 1.12, 25: 1.06, 30: 1.0, 35: 0.94, 40: 0.87, 45: 0.79, 50: 0.71, 55: 0.61, 60: 0.5 },
  xlpe90: { 10: 1.15, 15: 1.12, 20: 1.08, 25: 1.04, 30: 1.0, 35: 0.96, 40: 0.91, 45: 0.87, 50: 0.82, 55: 0.76, 60: 0.71 },
};

/** ground temperature (°C) → factor, method D (from memory) */
export const AMBIENT_GROUND: Record<'pvc70' | 'xlpe90', Readonly<Record<number, number>>> = {
  pvc70: { 10: 1.1, 15: 1.05, 20: 1.0, 25: 0.95, 30: 0.89, 35: 0.84, 40: 0.77, 45: 0.71, 50: 0.63 },
  xlpe90: { 10: 1.07, 15: 1.04, 20: 1.0, 25: 0.96, 30: 0.93, 35: 0.89, 40: 0.85, 45: 0.8, 50: 0.76 },
};

export const GROUND_REFERENCE_C = 20;
export const AIR_REFERENCE_C = 30;

/** number of circuits bunched → factor (Table B.52.17, row 1) */
export const GROUPING_BUNCHED: Readonly<Record<number, number>> = {
  1: 1.0, 2: 0.8, 3: 0.7, 4: 0.65, 5: 0.6, 6: 0.57, 7: 0.54, 8: 0.52, 9: 0.5, 12: 0.45, 16: 0.41, 20: 0.38,
};

/** length of contact with thermal insulation (mm) → factor (BS 7671 Table 52.2) */
export const THERMAL_INSULATION: Readonly<Record<number, number>> = { 50: 0.88, 100: 0.78, 200: 0.63, 400: 0.51 };
/** totally surrounded over more than this length (mm): factor THERMAL_SURROUNDED (BS 7671 523.9) */
export const THERMAL_SURROUNDED_FROM_MM = 500;
export const THERMAL_SURROUNDED = 0.5;
