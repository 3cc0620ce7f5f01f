// Device → its characteristic, built once per code and rating from the reference tables.
import { DEVICE_CODES, DEVICE_STANDARD, type DeviceCode } from '../../reference/device-codes.js';
import type { BreakerType } from '../../reference/circuit-breakers.js';
import { ratingProblem, ratingsMade } from '../../model/device-rating.js';
import { breakerCharacteristic } from './breakers.js';
import { bs3036Characteristic, bs88Part2Characteristic, bs88Part3Characteristic } from './fuses.js';
import type { Characteristic } from './characteristic.js';

export interface Device {
  code: DeviceCode;
  rating_a: number;
}

/** The B/C/D type of a circuit-breaker code, or null for a fuse. */
function typeOf(code: string): BreakerType | null {
  const m = /^(?:mcb|rcbo):([BCD])$/.exec(code);
  return m ? (m[1] as BreakerType) : null;
}

/** Each known code's type, read once (a code is asked about at every trial length). */
const TYPES: ReadonlyMap<string, BreakerType | null> = new Map(DEVICE_CODES.map((c) => [c, typeOf(c)]));

/** The B/C/D type of a circuit-breaker code, or null for a fuse. */
export function breakerType(code: DeviceCode): BreakerType | null {
  const t = TYPES.get(code);
  return t !== undefined ? t : typeOf(code);
}

function build({ code, rating_a }: Device): Characteristic | null {
  if (ratingProblem(code, rating_a) !== null) return null;
  const type = breakerType(code);
  if (type) return breakerCharacteristic(type, rating_a, DEVICE_STANDARD[code]);
  switch (code) {
    case 'fuse:gG': return bs88Part2Characteristic(rating_a);
    case 'fuse:bs88-3': return bs88Part3Characteristic(rating_a);
    case 'fuse:bs3036': return bs3036Characteristic(rating_a);
    default: return null;
  }
}

/**
 * The characteristics built, by code and then rating: only for the codes listed and the ratings
 * each family is made in, so the memo holds at most one entry per catalogue rating whatever is
 * asked (any other rating has no characteristic, and is answered without being kept).
 */
const built: ReadonlyMap<DeviceCode, Map<number, Characteristic | null>> = new Map(DEVICE_CODES.map((c) => [c, new Map()]));

/**
 * The device's characteristic, or null where the family does not make the rating or the library
 * holds no published points for it (then every query answers null: never a guess).
 */
export function characteristic(device: Device): Characteristic | null {
  const byRating = built.get(device.code);
  let c = byRating?.get(device.rating_a);
  if (c === undefined) {
    c = build(device);
    if (byRating && ratingsMade(device.code).includes(device.rating_a)) byRating.set(device.rating_a, c);
  }
  return c;
}
