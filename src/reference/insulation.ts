// Source: IEC 60364-6:2016, Table 6.1 (Table 6A in some national editions) — minimum values of
// insulation resistance and the d.c. test voltage for each circuit voltage band.

export interface InsulationBand {
  band: string;
  /** nominal circuit voltage up to (V) */
  circuit_upto_v: number;
  test_v: number;
  min_mohm: number;
}

export const INSULATION_MINIMUMS: readonly InsulationBand[] = [
  { band: 'SELV and PELV', circuit_upto_v: 50, test_v: 250, min_mohm: 0.5 },
  { band: 'up to and including 500 V', circuit_upto_v: 500, test_v: 500, min_mohm: 1.0 },
  { band: 'above 500 V', circuit_upto_v: 1000, test_v: 1000, min_mohm: 1.0 },
];

/** A reading below this is queried even when it meets the minimum (common practice). */
export const INSULATION_QUERY_BELOW_MOHM = 2;
