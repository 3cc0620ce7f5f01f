// Source: IEC 60898-1:2015, Table 7 (time-current operating characteristic) and 5.3.5 (standard
// instantaneous tripping ranges); IEC 61009-1 gives the same bands for RCBOs.
// Instantaneous tripping: type B above 3 In up to and including 5 In, C 5–10 In, D 10–20 In:
// no trip within 0.1 s at the lower multiple, trip within 0.1 s at the upper.

export type BreakerType = 'B' | 'C' | 'D';

export const INSTANTANEOUS: Record<BreakerType, { lower: number; upper: number }> = {
  B: { lower: 3, upper: 5 },
  C: { lower: 5, upper: 10 },
  D: { lower: 10, upper: 20 },
};

/** Ratings of IEC 60898-1 (preferred values, 6–125 A) as commonly made. */
export const BREAKER_RATINGS_A = [6, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125] as const;

/** Usual rated short-circuit capacity Icn of a final-circuit breaker (kA). */
export const BREAKER_USUAL_ICN_KA = 6;
