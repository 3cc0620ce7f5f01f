// Fuses: each edge a monotone curve through published points (see index.ts for the model).
// gG fuse-links (BS 88-2, BS 88-3) take the IEC 60269-1 conventional currents and gates; BS 3036
// semi-enclosed fuses take the BS 7671 points and their fusing factor.
import { GG_CONVENTIONAL, GG_GATES, type ConventionalBand } from '../../reference/fuses-iec-60269.js';
import { BS88_2_TABLE_U0_V, BS88_2_ZS_0_4S, BS88_2_ZS_5S } from '../../reference/fuses-bs88-2.js';
import { BS88_3_POINTS } from '../../reference/fuses-bs88-3.js';
import { BS3036_FUSING_FACTOR, BS3036_TABLE_U0_V, BS3036_ZS_0_4S, BS3036_ZS_5S } from '../../reference/fuses-bs3036.js';
import { checkedEdge, slope, type Edge, type Point } from './curve.js';
import type { Characteristic } from './characteristic.js';

const I2T_TAIL = 'constant I²t below the shortest published time';
const hours = (s: number): string => `${s / 3600} h`;

export function conventionalBand(ratingA: number): ConventionalBand {
  return GG_CONVENTIONAL.find((b) => ratingA < b.upto_a || (b.upto_inclusive && ratingA === b.upto_a))!;
}

/** Points read off BS 7671's max Zs tables: Ia = U0 / Zs at the table's U0. */
function fromZsTable(zs: number | undefined, u0: number, timeS: number, table: string): Point[] {
  return zs === undefined ? [] : [{ current_a: u0 / zs, time_s: timeS, source: `BS 7671 ${table}: ${u0} V / ${zs} Ω` }];
}

const byTimeDescending = (a: Point, b: Point): number => b.time_s - a.time_s;

/** A gG fuse-link: the conventional fusing point, the published points, the gates where the rating has one. */
function ggCharacteristic(ratingA: number, published: Point[], standard: string): Characteristic | null {
  const band = conventionalBand(ratingA);
  const gate = GG_GATES.find((g) => g.rating_a === ratingA);
  const gateSource = 'IEC 60269-1 gate';
  const points: Point[] = [...published];
  if (gate && !published.some((p) => p.time_s === 5)) {
    points.push({ current_a: gate.max_5s, time_s: 5, source: `${gateSource}: melts within 5 s` });
  }
  if (gate) points.push({ current_a: gate.max_0_1s, time_s: 0.1, source: `${gateSource}: melts within 0.1 s` });
  if (points.length === 0) return null;
  points.push({
    current_a: band.if * ratingA,
    time_s: band.time_s,
    source: `IEC 60269-1 conventional fusing current ${band.if} In within ${hours(band.time_s)} (${band.band})`,
  });
  const what = `${standard} ${ratingA} A`;
  const slowest = checkedEdge({ points: points.sort(byTimeDescending), tail: 'i2t', tailSource: I2T_TAIL }, `${what} slowest`);
  const fastest: Edge | null = gate
    ? checkedEdge({
      points: [
        { current_a: band.inf * ratingA, time_s: band.time_s, source: `IEC 60269-1 conventional non-fusing current ${band.inf} In carried for ${hours(band.time_s)}` },
        { current_a: gate.min_10s, time_s: 10, source: `${gateSource}: does not melt within 10 s` },
        { current_a: gate.min_0_1s, time_s: 0.1, source: `${gateSource}: does not melt within 0.1 s` },
      ],
      tail: 'none',
      tailSource: 'no minimum pre-arcing time is published below 0.1 s',
    }, `${what} fastest`)
    : null;
  return { slowest, fastest, source: `${standard} (gG, IEC 60269-1)` };
}

export function bs88Part2Characteristic(ratingA: number): Characteristic | null {
  const published = [
    ...fromZsTable(BS88_2_ZS_5S[ratingA], BS88_2_TABLE_U0_V, 5, 'Table 41.4'),
    ...fromZsTable(BS88_2_ZS_0_4S[ratingA], BS88_2_TABLE_U0_V, 0.4, 'Table 41.2'),
  ];
  return ggCharacteristic(ratingA, published, 'BS 88-2');
}

/**
 * BS 88-3: only points with a documented published source (reference/fuses-bs88-3.ts); none held,
 * the fuse has no characteristic (the IEC 60269-1 gates alone do not describe it).
 */
export function bs88Part3Characteristic(ratingA: number): Characteristic | null {
  const published = BS88_3_POINTS[ratingA] ?? [];
  if (published.length === 0) return null;
  return ggCharacteristic(ratingA, [...published], 'BS 88-3');
}

/**
 * BS 3036: the BS 7671 points; below the lowest published current, the slope of the two lowest
 * points continued down to the fusing factor's 2 In (assumption); nothing below 2 In.
 */
export function bs3036Characteristic(ratingA: number): Characteristic | null {
  const points = [
    ...fromZsTable(BS3036_ZS_5S[ratingA], BS3036_TABLE_U0_V, 5, 'Table 41.4'),
    ...fromZsTable(BS3036_ZS_0_4S[ratingA], BS3036_TABLE_U0_V, 0.4, 'Table 41.2'),
  ].sort(byTimeDescending);
  if (points.length === 0) return null;
  const floor = BS3036_FUSING_FACTOR * ratingA;
  const [a, b] = points;
  if (a && b && floor < a.current_a) {
    points.unshift({
      current_a: floor,
      time_s: a.time_s * (floor / a.current_a) ** slope(a, b),
      source: `fusing factor ${BS3036_FUSING_FACTOR} (BS 3036) on the line of the two lowest published points (assumption)`,
    });
  }
  const slowest = checkedEdge({ points, tail: 'i2t', tailSource: I2T_TAIL }, `BS 3036 ${ratingA} A slowest`);
  return { slowest, fastest: null, source: 'BS 3036 (semi-enclosed), BS 7671 Tables 41.2 / 41.4' };
}
