// Source: BS 7671:2008 (17th edition, amendment 1) Tables 41.2 and 41.4 — maximum earth fault loop
// impedance Zs (Ω) for fuses to BS 88-2 (fuse systems E and G), U0 = 230 V, no Cmin, as quoted in
// the team's REFERENCE.md. Each value is Zs = U0 / Ia, Ia read from the BS 88-2 time-current
// characteristic (BS 7671 Appendix 3).

export const BS88_2_TABLE_U0_V = 230;

/** Max Zs (Ω) at 0.4 s (Table 41.2). */
export const BS88_2_ZS_0_4S: Readonly<Record<number, number>> = {
  6: 8.21, 10: 4.89, 16: 2.56, 20: 1.77, 25: 1.35, 32: 1.04,
};

/** Max Zs (Ω) at 5 s (Table 41.4). */
export const BS88_2_ZS_5S: Readonly<Record<number, number>> = {
  6: 13.5, 10: 7.42, 16: 4.18, 20: 2.91, 25: 2.30, 32: 1.84, 40: 1.35, 50: 1.04, 63: 0.82, 80: 0.57,
  100: 0.42, 125: 0.33, 160: 0.25, 200: 0.19,
};
