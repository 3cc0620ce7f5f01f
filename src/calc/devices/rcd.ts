// An RCD's slowest break time at a residual current: the limit values of IEC 61008-1 / 61009-1 at
// 1, 2 and 5 × IΔn, held between the test multiples (the standard promises nothing faster until
// the next one), nothing promised below IΔn.
import { RCD_BREAK_TIMES, type BreakTimes, type RcdKind } from '../../reference/rcd.js';
import type { RcdType } from '../../model/schema.js';
import { withBasis } from '../basis.js';

export const rcdKind = (type: RcdType | undefined): RcdKind => (type?.endsWith('-S') ? 'S' : 'general');

/** Each kind's test multiples, highest first: the first one a current reaches is the one that holds. */
const DOWNWARDS: Readonly<Record<RcdKind, readonly BreakTimes[]>> = {
  general: [...RCD_BREAK_TIMES.general].reverse(),
  S: [...RCD_BREAK_TIMES.S].reverse(),
};

export function rcdBreakTime(ratedMa: number, type: RcdType | undefined, currentA: number): { time_s: number; basis: string } | null {
  const kind = rcdKind(type);
  const multiple = currentA / (ratedMa / 1000);
  const step = DOWNWARDS[kind].find((l) => multiple >= l.multiple);
  if (!step) return null;
  return withBasis({ time_s: step.max_ms / 1000 },
    () => `the ${ratedMa} mA ${kind === 'S' ? 'time-delayed ' : ''}RCD breaks within ${step.max_ms} ms at ${step.multiple} × IΔn and above (IEC 61008-1 / 61009-1)`);
}
