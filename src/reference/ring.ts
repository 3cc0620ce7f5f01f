// Source: common practice for testing ring final circuits (packsmith REFERENCE.md, "Ring final
// circuits"): end-to-end r1 and rn agree within 0.05 Ω; r2 ≈ r1 × live csa / cpc csa; each
// cross-connected reading ≈ (r1 + rn)/4 and (r1 + r2)/4, higher at spurs. The same 0.05 Ω is
// taken as the allowance for the r2 and cross-connected comparisons.

export const RING_TOLERANCE_OHM = 0.05;
