// Source: IEC 60364-4-41:2005, Table 41.1 — maximum disconnection times for final circuits (a.c.),
// and 411.3.2.3 / 411.3.2.4 — 5 s (TN) and 1 s (TT) for distribution circuits.

export interface DisconnectionBand {
  /** U0 above this (V) ... */
  u0_above_v: number;
  /** ... and up to this (V) */
  u0_upto_v: number;
  tn_s: number;
  tt_s: number;
}

export const TABLE_41_1: readonly DisconnectionBand[] = [
  { u0_above_v: 50, u0_upto_v: 120, tn_s: 0.8, tt_s: 0.3 },
  { u0_above_v: 120, u0_upto_v: 230, tn_s: 0.4, tt_s: 0.2 },
  { u0_above_v: 230, u0_upto_v: 400, tn_s: 0.2, tt_s: 0.07 },
  { u0_above_v: 400, u0_upto_v: Infinity, tn_s: 0.1, tt_s: 0.04 },
];

export const DISTRIBUTION_TN_S = 5;
export const DISTRIBUTION_TT_S = 1;
/** final circuits up to this current take Table 41.1 (IEC 60364-4-41:2005, 411.3.2.2) */
export const FINAL_CIRCUIT_LIMIT_A = 32;
