// Source: BS 88-3:2010 (fuse system C of IEC 60269-3) — fuse-links for household use. No
// time-current point of BS 88-3 with a documented published source is at hand (packsmith
// REFERENCE.md): the earlier 20 A point (Ia ≈ 113 A at 0.4 s) was wrong and is withdrawn, since it
// made the household fuse faster than the BS 88-2 fuse of the same rating. So the library holds no
// BS 88-3 characteristic; a circuit gives its maker's current (device_ia_a) or stays not verified.
// A point may be added here only with its published source beside it. Rated currents and the
// 16.5 kA breaking capacity are from memory.

export const BS88_3_RATINGS_A = [5, 16, 20, 32, 45, 63, 80, 100] as const;

/** Currents (A) that operate the fuse within the time, each with its published source. */
export const BS88_3_POINTS: Readonly<Record<number, readonly { time_s: number; current_a: number; source: string }[]>> = {};

export const BS88_3_USUAL_BREAKING_KA = 16.5;
