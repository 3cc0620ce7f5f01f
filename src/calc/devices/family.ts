// A device family: its standard, the ratings it is made in and its usual breaking capacity.
import { DEVICE_STANDARD, type DeviceCode } from '../../reference/device-codes.js';
import { BREAKER_USUAL_ICN_KA } from '../../reference/circuit-breakers.js';
import { GG_USUAL_BREAKING_KA } from '../../reference/fuses-iec-60269.js';
import { BS88_3_USUAL_BREAKING_KA } from '../../reference/fuses-bs88-3.js';
import { BS3036_USUAL_BREAKING_KA } from '../../reference/fuses-bs3036.js';
import { ratingsMade } from '../../model/device-rating.js';

export interface DeviceFamily {
  code: DeviceCode;
  standard: string;
  ratings_a: readonly number[];
  /** the breaking capacity assumed where circuits.csv gives none (kA) */
  breaking_ka: number;
}

const BREAKING_KA: Record<DeviceCode, number> = {
  'mcb:B': BREAKER_USUAL_ICN_KA, 'mcb:C': BREAKER_USUAL_ICN_KA, 'mcb:D': BREAKER_USUAL_ICN_KA,
  'rcbo:B': BREAKER_USUAL_ICN_KA, 'rcbo:C': BREAKER_USUAL_ICN_KA, 'rcbo:D': BREAKER_USUAL_ICN_KA,
  'fuse:gG': GG_USUAL_BREAKING_KA,
  'fuse:bs88-3': BS88_3_USUAL_BREAKING_KA,
  'fuse:bs3036': BS3036_USUAL_BREAKING_KA,
};

export function deviceFamily(code: DeviceCode): DeviceFamily {
  return { code, standard: DEVICE_STANDARD[code], ratings_a: ratingsMade(code), breaking_ka: BREAKING_KA[code] };
}
