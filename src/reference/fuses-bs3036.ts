// Source: BS 7671:2008 (17th edition) Tables 41.2 and 41.4 — maximum earth fault loop impedance
// Zs (Ω) for semi-enclosed fuses to BS 3036, U0 = 230 V, no Cmin, as quoted in the team's
// REFERENCE.md (0.4 s is not tabulated for 45, 60 and 100 A). BS 3036:1958 for the element ratings,
// the breaking-capacity categories S1A / S2A / S4A (1 / 2 / 4 kA) and the fusing factor: an element
// carries its rating indefinitely and is not guaranteed to open below about 2 × In (REFERENCE.md).

export const BS3036_TABLE_U0_V = 230;

export const BS3036_RATINGS_A = [5, 15, 20, 30, 45, 60, 100] as const;

/** Max Zs (Ω) at 0.4 s (Table 41.2). */
export const BS3036_ZS_0_4S: Readonly<Record<number, number>> = { 5: 9.58, 15: 2.55, 20: 1.77, 30: 1.09 };

/** Max Zs (Ω) at 5 s (Table 41.4). */
export const BS3036_ZS_5S: Readonly<Record<number, number>> = {
  5: 17.7, 15: 5.35, 20: 3.83, 30: 2.64, 45: 1.59, 60: 1.12, 100: 0.53,
};

/** Below this multiple of In an element is not guaranteed to open at all. */
export const BS3036_FUSING_FACTOR = 2;

/** Category S1A, the lowest; a board of category S2A or S4A says so in circuits.csv (breaking_ka). */
export const BS3036_USUAL_BREAKING_KA = 1;
