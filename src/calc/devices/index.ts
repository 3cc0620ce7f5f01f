// The protective device library: how fast each protective device opens at a given fault current.
//
// The model. Every device has a band between two edges in the time-current plane; each edge is a
// set of points joined by straight lines in log I – log t (curve.ts), undefined below its first
// point's current, with a tail beyond its last point.
// - The slowest edge is the longest operating time the standard permits: verification relies on
//   it (Ia for a required time, max Zs = U0 × Cmin / Ia, the disconnection time at a fault current,
//   the I²t for the adiabatic check). Below its first current the device is not known to operate.
// - The fastest edge, where the standard gives one, is the other side of the band; it is drawn,
//   never relied on.
//
// Circuit-breakers, mcb (IEC 60898-1) and rcbo (IEC 61009-1, the same bands), from cold:
// - slowest: a staircase through the guaranteed points — within the conventional time (1 h, 2 h
//   above 63 A) from 1.45 In, within 60 s (120 s above 32 A) from 2.55 In, within 0.1 s from the
//   upper instantaneous multiple k (B 5, C 10, D 20). The standard promises nothing faster between
//   them, so no credit is taken for the thermal release: for any required time from 0.1 s up to
//   60 s every type answers Ia = k In, as BS 7671 Table 41.3 does for 0.4 s and 5 s alike.
// - fastest: no trip within the conventional time at 1.13 In, within 1 s at 2.55 In, within 0.1 s
//   at the lower multiple (B 3, C 5, D 10); above that the instantaneous release may trip at once.
// Fuses:
// - gG fuse-links (fuse:gG — BS 88-2 / IEC 60269-2; fuse:bs88-3 — BS 88-3 / IEC 60269-3, also gG,
//   held only where a published BS 88-3 point is documented: none today, so a circuit gives device_ia_a):
//   slowest through the conventional fusing current If within the conventional time
//   (IEC 60269-1 Table 2), the BS 7671 Table 41.4 / 41.2 points at 5 s and 0.4 s where published,
//   else the IEC 60269-1 gate Imax(5 s), and the gate Imax(0.1 s); fastest through the
//   conventional non-fusing current Inf (carried for the conventional time) and the gates
//   Imin(10 s) and Imin(0.1 s). A fuse carries Inf, and so its rating, indefinitely.
// - BS 3036 semi-enclosed: slowest through the BS 7671 points; below the lowest published current
//   the line of the two lowest points is continued down to 2 In (fusing factor 2, an assumption
//   that only shapes the overload region, beyond any disconnection time the rules ask); nothing
//   below 2 In; no fastest edge.
// - Below the shortest published time the slowest edge holds I²t constant (melting tends to
//   adiabatic at high currents, so this is the longer time: conservative).
// A rating the family does not make, or one without published points, has no characteristic:
// every query answers null and the checks stay not-verified.
export type { Device } from './lookup.js';
export { characteristic, breakerType } from './lookup.js';
export type { Characteristic } from './characteristic.js';
export type { Edge, Point, Tail } from './curve.js';
export { timeAt } from './curve.js';
export { maxZs, makerIa, operatingTime, currentForTime, energyAt, measuredFault, type MaxZs } from './queries.js';
export { deviceFamily, type DeviceFamily } from './family.js';
export { ratingProblem } from '../../model/device-rating.js';
