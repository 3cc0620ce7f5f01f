// Circuit-breakers (mcb: IEC 60898-1, rcbo: IEC 61009-1, the same bands): the two edges of the band
// from Table 7 and the instantaneous ranges. See index.ts for the model and its assumptions.
import { AT_2_55, CONVENTIONAL, INSTANTANEOUS, INSTANTANEOUS_TIME_S, type BreakerType } from '../../reference/circuit-breakers.js';
import { checkedEdge } from './curve.js';
import type { Characteristic } from './characteristic.js';

export function breakerCharacteristic(type: BreakerType, ratingA: number, standard: string): Characteristic {
  const In = ratingA;
  const band = INSTANTANEOUS[type];
  const conventionalS = In <= CONVENTIONAL.time_s.upto_a ? CONVENTIONAL.time_s.upto : CONVENTIONAL.time_s.above;
  const at255S = In <= AT_2_55.max_s.upto_a ? AT_2_55.max_s.upto : AT_2_55.max_s.above;
  const m = AT_2_55.multiple;
  const table7 = `${standard} Table 7`;
  const what = `${type}${In}`;
  // The slowest permitted edge is a staircase through the guaranteed points: the standard promises
  // nothing faster between them, so verification takes no credit for the thermal release there.
  const slowest = checkedEdge({
    points: [
      { current_a: CONVENTIONAL.tripping * In, time_s: conventionalS, source: `${table7}: trips within ${conventionalS / 3600} h at ${CONVENTIONAL.tripping} In` },
      { current_a: m * In, time_s: conventionalS, source: `${table7}: no faster trip promised below ${m} In` },
      { current_a: m * In, time_s: at255S, source: `${table7}: trips within ${at255S} s at ${m} In` },
      { current_a: band.upper * In, time_s: at255S, source: `${table7}: no faster trip promised below ${band.upper} In` },
      { current_a: band.upper * In, time_s: INSTANTANEOUS_TIME_S, source: `type ${type} instantaneous trip within ${INSTANTANEOUS_TIME_S} s at ${band.upper} In, ${standard}` },
    ],
    tail: 'flat',
    tailSource: `no faster trip than ${INSTANTANEOUS_TIME_S} s is promised`,
  }, `${what} slowest`);
  const fastest = checkedEdge({
    points: [
      { current_a: CONVENTIONAL.non_tripping * In, time_s: conventionalS, source: `${table7}: no trip within ${conventionalS / 3600} h at ${CONVENTIONAL.non_tripping} In` },
      { current_a: m * In, time_s: AT_2_55.min_s, source: `${table7}: no trip within ${AT_2_55.min_s} s at ${m} In` },
      { current_a: band.lower * In, time_s: INSTANTANEOUS_TIME_S, source: `type ${type}: no trip within ${INSTANTANEOUS_TIME_S} s at ${band.lower} In` },
    ],
    tail: 'none',
    tailSource: `above ${band.lower} In the instantaneous release may trip at once`,
  }, `${what} fastest`);
  return { slowest, fastest, source: `${standard}, type ${type}` };
}
