// One edge of a device's time-current band: points joined by straight lines in log I – log t,
// nothing below the first point's current, and a tail beyond the last point. Pure arithmetic.
import { toSignificant } from '../../model/units.js';

export interface Point {
  current_a: number;
  time_s: number;
  /** where the point comes from, for basis lines */
  source: string;
}

/**
 * Beyond the last point: `i2t` holds I²t constant (time falls as 1/I²), `flat` holds the time
 * (no faster operation is promised), `none` leaves the edge undefined (no bound is published).
 */
export type Tail = 'i2t' | 'flat' | 'none';

export interface Edge {
  /**
   * current never decreasing, time never increasing, and never both equal: two points at one
   * current make a vertical step, two at one time a flat step (no faster operation promised)
   */
  points: readonly Point[];
  tail: Tail;
  /** what the tail is, for basis lines */
  tailSource: string;
}

/** Throws when the points do not make a monotone edge: reference data that cannot be used. */
export function checkedEdge(edge: Edge, what: string): Edge {
  const p = edge.points;
  if (p.length === 0) throw new Error(`${what}: an edge needs at least one point`);
  for (let i = 1; i < p.length; i++) {
    const a = p[i - 1]!;
    const b = p[i]!;
    if (!(b.current_a >= a.current_a && b.time_s <= a.time_s) || (b.current_a === a.current_a && b.time_s === a.time_s)) {
      throw new Error(`${what}: ${b.current_a} A at ${b.time_s} s does not follow ${a.current_a} A at ${a.time_s} s`);
    }
    if (i >= 2 && b.current_a === a.current_a && a.current_a === p[i - 2]!.current_a) {
      throw new Error(`${what}: three points at ${a.current_a} A`);
    }
    if (i >= 2 && b.time_s === a.time_s && a.time_s === p[i - 2]!.time_s) {
      throw new Error(`${what}: three points at ${a.time_s} s`);
    }
  }
  return edge;
}

/** The exponent of the straight line through two points in log I – log t. */
export const slope = (a: Point, b: Point): number => Math.log(b.time_s / a.time_s) / Math.log(b.current_a / a.current_a);

/** Time on the edge at a current, or null where the edge is not defined (below its first point, or a `none` tail). */
export function timeAt(edge: Edge, currentA: number): number | null {
  const p = edge.points;
  if (!(currentA >= p[0]!.current_a)) return null;
  let k = p.length - 1;
  while (p[k]!.current_a > currentA) k--;
  const a = p[k]!;
  if (currentA === a.current_a) return a.time_s;
  if (k < p.length - 1) {
    const b = p[k + 1]!;
    return a.time_s * (currentA / a.current_a) ** slope(a, b);
  }
  switch (edge.tail) {
    case 'i2t': return a.time_s * (a.current_a / currentA) ** 2;
    case 'flat': return a.time_s;
    case 'none': return null;
  }
}

export interface Located {
  current_a: number;
  /** how the current was found, naming the points used */
  how: string;
}

const at = (p: Point): string => `${show(p.current_a)} A at ${show(p.time_s)} s`;

/** Up to 4 significant digits, for basis lines. */
export function show(n: number): string {
  return String(toSignificant(n, 4));
}

/** The smallest current at which the edge's time is at most `timeS`, or null where none is. */
export function currentFor(edge: Edge, timeS: number): Located | null {
  const p = edge.points;
  const first = p[0]!;
  if (!(timeS > 0)) return null;
  if (timeS >= first.time_s) return { current_a: first.current_a, how: `${at(first)}: ${first.source}` };
  for (let k = 0; k < p.length - 1; k++) {
    const a = p[k]!;
    const b = p[k + 1]!;
    if (timeS < b.time_s) continue;
    if (timeS === b.time_s || a.current_a === b.current_a) return { current_a: b.current_a, how: `${at(b)}: ${b.source}` };
    const current = a.current_a * (timeS / a.time_s) ** (1 / slope(a, b));
    return { current_a: current, how: `log-log between ${at(a)} [${a.source}] and ${at(b)} [${b.source}]` };
  }
  const last = p[p.length - 1]!;
  if (edge.tail !== 'i2t') return null;
  return {
    current_a: last.current_a * Math.sqrt(last.time_s / timeS),
    how: `${edge.tailSource}, from ${at(last)} [${last.source}]`,
  };
}
