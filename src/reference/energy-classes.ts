// Source: BS EN 60898-1 Annex ZA (energy limiting classes 1, 2, 3 of type B and C circuit-breakers
// up to 32 A, by rated short-circuit capacity Icn 3, 4.5, 6 and 10 kA): the maximum I²t (A²s) a
// breaker of the class lets through at any fault current up to its Icn. The 10 kA values of the
// class 2 and 3 rows up to 16 A (B 240 000 / 70 000, C 290 000 / 84 000) are as reproduced in a
// public discussion of Annex ZA (electriciansforums.net, "adiabatic equation"); every other value
// is from memory. Class 1 sets no limit.

export type EnergyClass = 1 | 2 | 3;

/** Icn columns (kA) */
export const ENERGY_CLASS_ICN_KA = [3, 4.5, 6, 10] as const;

export interface EnergyClassRow {
  type: 'B' | 'C';
  /** ratings above `above_a` up to and including `upto_a` */
  above_a: number;
  upto_a: number;
  cls: 2 | 3;
  /** I²t limit (A²s) for each Icn column */
  i2t_a2s: readonly [number, number, number, number];
}

export const ENERGY_CLASS_LIMITS: readonly EnergyClassRow[] = [
  { type: 'B', above_a: 0, upto_a: 16, cls: 2, i2t_a2s: [31000, 60000, 100000, 240000] },
  { type: 'B', above_a: 16, upto_a: 32, cls: 2, i2t_a2s: [40000, 80000, 130000, 310000] },
  { type: 'C', above_a: 0, upto_a: 16, cls: 2, i2t_a2s: [37000, 75000, 120000, 290000] },
  { type: 'C', above_a: 16, upto_a: 32, cls: 2, i2t_a2s: [48000, 96000, 150000, 370000] },
  { type: 'B', above_a: 0, upto_a: 16, cls: 3, i2t_a2s: [15000, 25000, 35000, 70000] },
  { type: 'B', above_a: 16, upto_a: 32, cls: 3, i2t_a2s: [18000, 32000, 45000, 90000] },
  { type: 'C', above_a: 0, upto_a: 16, cls: 3, i2t_a2s: [18000, 30000, 42000, 84000] },
  { type: 'C', above_a: 16, upto_a: 32, cls: 3, i2t_a2s: [22000, 39000, 55000, 110000] },
];
