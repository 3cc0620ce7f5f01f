// Source: common practice for testing ring final circuits (packsmith REFERENCE.md, "Ring final
// circuits"): end-to-end r1 and rn agree within 0.05 Ω; r2 ≈ r1 × live csa / cpc csa; each
// cross-connected reading ≈ (r1 + rn)/4 and (r1 + r2)/4, higher at spurs. The same 0.05 Ω is
// taken as the allowance for the r2 and cross-connected comparisons.
// BS 7671 433.1.204: a ring final circuit with accessories to BS 1363, protected by a 30 A or 32 A
// device, copper live conductors of at least 2.5 mm², is deemed protected against overload where
// the current-carrying capacity Iz of its cable is at least 20 A.

export const RING_TOLERANCE_OHM = 0.05;

export const RING_RULE = {
  device_ratings_a: [30, 32],
  min_live_mm2: 2.5,
  material: 'cu',
  min_iz_a: 20,
  clause: 'BS 7671 433.1.204',
} as const;
