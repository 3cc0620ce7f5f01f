// The ratings each device family is made in, and the input error for one it is not made in.
// Here (not in calc) so validation can report it as file:row:column without importing calc.
import { DEVICE_STANDARD, type DeviceCode } from '../reference/device-codes.js';
import { BREAKER_RATINGS_A } from '../reference/circuit-breakers.js';
import { GG_RATINGS_A } from '../reference/fuses-iec-60269.js';
import { BS88_3_RATINGS_A } from '../reference/fuses-bs88-3.js';
import { BS3036_RATINGS_A } from '../reference/fuses-bs3036.js';
import { fmt } from './units.js';

const RATINGS: Record<DeviceCode, readonly number[]> = {
  'mcb:B': BREAKER_RATINGS_A, 'mcb:C': BREAKER_RATINGS_A, 'mcb:D': BREAKER_RATINGS_A,
  'rcbo:B': BREAKER_RATINGS_A, 'rcbo:C': BREAKER_RATINGS_A, 'rcbo:D': BREAKER_RATINGS_A,
  'fuse:gG': GG_RATINGS_A,
  'fuse:bs88-3': BS88_3_RATINGS_A,
  'fuse:bs3036': BS3036_RATINGS_A,
};

/** The rated currents (A) a family is made in, ascending. */
export const ratingsMade = (code: DeviceCode): readonly number[] => RATINGS[code];

/** Whether `ratingA` is the sum of two or three elements of the listed ratings. */
function twistedSum(ratingA: number, made: readonly number[]): boolean {
  for (const a of made) {
    for (const b of made) {
      if (a + b === ratingA) return true;
      for (const c of made) if (a + b + c === ratingA) return true;
    }
  }
  return false;
}

/** null when the family makes the rating; otherwise what was found and the ratings it is made in. */
export function ratingProblem(code: DeviceCode, ratingA: number): string | null {
  const made = RATINGS[code];
  if (made.includes(ratingA)) return null;
  let message = `found ${fmt(ratingA, 6)} A; ${code} (${DEVICE_STANDARD[code]}) is made in ${made.join(', ')} A`;
  if (code === 'fuse:bs3036' && twistedSum(ratingA, made)) {
    message += '; two or three elements twisted together are not an element of their summed rating';
  }
  return message;
}
