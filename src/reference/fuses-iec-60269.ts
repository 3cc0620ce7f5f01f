// Source: IEC 60269-1 — Table 2 (conventional non-fusing and fusing currents and conventional times
// of gG fuse-links), Table 3 (gates: limits of the pre-arcing time-current zone of gG fuse-links)
// and 5.3.1 (rated currents). All values here are from memory, except the 1.25 / 1.6 In factors
// for 16–63 A, which the team's REFERENCE.md also gives (itself from memory). They apply to every
// gG fuse-link: BS 88-2 (IEC 60269-2 systems E and G) and BS 88-3 (IEC 60269-3 system C).

export interface ConventionalBand {
  /** the band of rated currents as the standard words it */
  band: string;
  /** the band ends at this rated current (A) ... */
  upto_a: number;
  /** ... which belongs to it (≤) or not (<) */
  upto_inclusive: boolean;
  /** conventional non-fusing current Inf, multiple of In: carried for the conventional time */
  inf: number;
  /** conventional fusing current If, multiple of In: operates within the conventional time */
  if: number;
  time_s: number;
}

/** In band order: a rating takes the first band it falls in. */
export const GG_CONVENTIONAL: readonly ConventionalBand[] = [
  { band: 'In ≤ 4 A', upto_a: 4, upto_inclusive: true, inf: 1.5, if: 2.1, time_s: 3600 },
  { band: '4 A < In < 16 A', upto_a: 16, upto_inclusive: false, inf: 1.5, if: 1.9, time_s: 3600 },
  { band: '16 A ≤ In ≤ 63 A', upto_a: 63, upto_inclusive: true, inf: 1.25, if: 1.6, time_s: 3600 },
  { band: '63 A < In ≤ 160 A', upto_a: 160, upto_inclusive: true, inf: 1.25, if: 1.6, time_s: 7200 },
  { band: '160 A < In ≤ 400 A', upto_a: 400, upto_inclusive: true, inf: 1.25, if: 1.6, time_s: 10800 },
  { band: 'In > 400 A', upto_a: Infinity, upto_inclusive: true, inf: 1.25, if: 1.6, time_s: 14400 },
];

/**
 * Gates for gG fuse-links (A): at `min_10s` the pre-arcing time is at least 10 s, at `max_5s` at
 * most 5 s, at `min_0_1s` at least 0.1 s, at `max_0_1s` at most 0.1 s. Listed to 200 A, the range
 * the BS 7671 points below cross-check (every BS 88-2 5 s point lies inside its gate).
 */
export interface Gate {
  rating_a: number;
  min_10s: number;
  max_5s: number;
  min_0_1s: number;
  max_0_1s: number;
}

export const GG_GATES: readonly Gate[] = [
  { rating_a: 16, min_10s: 33, max_5s: 65, min_0_1s: 85, max_0_1s: 150 },
  { rating_a: 20, min_10s: 42, max_5s: 85, min_0_1s: 110, max_0_1s: 200 },
  { rating_a: 25, min_10s: 52, max_5s: 110, min_0_1s: 150, max_0_1s: 260 },
  { rating_a: 32, min_10s: 75, max_5s: 150, min_0_1s: 200, max_0_1s: 350 },
  { rating_a: 40, min_10s: 95, max_5s: 190, min_0_1s: 260, max_0_1s: 450 },
  { rating_a: 50, min_10s: 125, max_5s: 250, min_0_1s: 350, max_0_1s: 610 },
  { rating_a: 63, min_10s: 160, max_5s: 320, min_0_1s: 450, max_0_1s: 820 },
  { rating_a: 80, min_10s: 215, max_5s: 425, min_0_1s: 610, max_0_1s: 1100 },
  { rating_a: 100, min_10s: 290, max_5s: 580, min_0_1s: 820, max_0_1s: 1450 },
  { rating_a: 125, min_10s: 355, max_5s: 715, min_0_1s: 1100, max_0_1s: 1910 },
  { rating_a: 160, min_10s: 460, max_5s: 950, min_0_1s: 1450, max_0_1s: 2590 },
  { rating_a: 200, min_10s: 610, max_5s: 1250, min_0_1s: 1910, max_0_1s: 3420 },
];

/** Rated currents of gG fuse-links (5.3.1). */
export const GG_RATINGS_A = [2, 4, 6, 8, 10, 12, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315,
  400, 500, 630, 800, 1000, 1250] as const;

/** IEC 60269-2: fuses for use by authorized persons break at least 50 kA at 400 V a.c. */
export const GG_USUAL_BREAKING_KA = 50;
