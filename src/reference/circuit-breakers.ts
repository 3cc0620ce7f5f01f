// Source: IEC 60898-1:2015, Table 7 (time-current operating characteristic) and 5.3.5 (standard
// instantaneous tripping ranges); IEC 61009-1 gives the same bands for RCBOs. Values as quoted in
// the team's REFERENCE.md; the preferred ratings (5.3.2) are from memory.
// Instantaneous tripping: type B above 3 In up to and including 5 In, C 5–10 In, D 10–20 In:
// no trip within 0.1 s at the lower multiple, trip within 0.1 s at the upper.

export type BreakerType = 'B' | 'C' | 'D';

export const INSTANTANEOUS: Record<BreakerType, { lower: number; upper: number }> = {
  B: { lower: 3, upper: 5 },
  C: { lower: 5, upper: 10 },
  D: { lower: 10, upper: 20 },
};

/** The instantaneous trip happens within this time at the upper multiple; not before it at the lower. */
export const INSTANTANEOUS_TIME_S = 0.1;

/** Table 7, tests a and b: conventional non-tripping / tripping currents (multiples of In), from cold. */
export const CONVENTIONAL = {
  non_tripping: 1.13,
  tripping: 1.45,
  /** conventional time (s) for In up to and including `upto_a`, and above it */
  time_s: { upto_a: 63, upto: 3600, above: 7200 },
} as const;

/** Table 7, test c: at 2.55 In, trip after more than 1 s and within 60 s (In ≤ 32 A) or 120 s (In > 32 A). */
export const AT_2_55 = {
  multiple: 2.55,
  min_s: 1,
  max_s: { upto_a: 32, upto: 60, above: 120 },
} as const;

/** Preferred rated currents (5.3.2), 6–125 A; IEC 61009-1 lists the same for RCBOs (from memory). */
export const BREAKER_RATINGS_A = [6, 8, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125] as const;

/** Usual rated short-circuit capacity Icn of a final-circuit breaker (kA): IEC 60898-1 standard values 6 and 10 kA. */
export const BREAKER_USUAL_ICN_KA = 6;
