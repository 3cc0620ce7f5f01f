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

/**
 * Where surge protective devices or other equipment cannot be disconnected, a circuit up to 500 V
 * may be tested at 250 V d.c.; the minimum is then 1 MΩ (BS 7671 643.3; IEC 60364-6, 6.4.3.3).
 */
export const REDUCED_TEST = { test_v: 250, min_mohm: 1.0, for_band_test_v: 500, clause: 'BS 7671 643.3; IEC 60364-6, 6.4.3.3' } as const;
