// Source: IEC 60364-4-41:2005, 411.5.3 — TT systems protected by an RCD: RA × IΔn ≤ 50 V, where
// RA is the sum of the resistances of the earth electrode and the protective conductors to the
// exposed-conductive-parts, and 50 V is the conventional touch voltage limit UL (a.c.).

export const TOUCH_VOLTAGE_LIMIT_V = 50;

/**
 * An electrode resistance above this may not be stable (drying, freezing), even where RA × IΔn
 * meets the limit: BS 7671 Table 41.5, note (from memory); common practice queries it.
 */
export const ELECTRODE_QUERY_ABOVE_OHM = 200;
