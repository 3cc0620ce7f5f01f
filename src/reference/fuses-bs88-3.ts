// Source: BS 88-3:2010 (fuse system C of IEC 60269-3) — fuse-links for household use. They are gG
// fuse-links, so the IEC 60269-1 conventional currents and gates (fuses-iec-60269.ts) bound them.
// The one BS 88-3 point of the team's REFERENCE.md: BS 7671 (17th edition, amendment 1) Table 41.2,
// 20 A at 0.4 s, Ia ≈ 113 A at U0 = 230 V. Rated currents and the 16.5 kA breaking capacity are
// from memory.

export const BS88_3_RATINGS_A = [5, 16, 20, 32, 45, 63, 80, 100] as const;

/** Currents (A) that operate the fuse within the time, published for BS 88-3 itself. */
export const BS88_3_POINTS: Readonly<Record<number, readonly { time_s: number; current_a: number }[]>> = {
  20: [{ time_s: 0.4, current_a: 113 }],
};

export const BS88_3_USUAL_BREAKING_KA = 16.5;
