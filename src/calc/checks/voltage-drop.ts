// Voltage drop from the origin of the installation against the rule set's limit (lighting 3 %,
// other uses 5 %; IEC 60364-5-52 Annex G, Table G.52.1, limits measured from the origin): the
// circuit's own drop plus that of every feeding circuit between the origin and its board.
import type { CircuitContext, LengthCheck, VdOrigin } from '../types.js';
import type { VoltageDrop } from '../design/voltage-drop.js';
import { notVerified, result } from './result.js';
import { originWords } from '../tree/origin.js';
import { toPlaces } from '../../model/units.js';

/** The drop from the origin: the circuit's own where the context carries none, null where a feeding circuit's is not known. */
const fromOrigin = (own: VoltageDrop, vdOrigin: CircuitContext['vdOrigin']): VdOrigin | null =>
  (vdOrigin === undefined ? { percent: own.percent, legs: [] } : vdOrigin);

const judge = ({ design, vdOrigin }: CircuitContext) => {
  const id = 'voltage-drop';
  if (!design.vd) return notVerified(id, 'no conductor resistance for this size and material in IEC 60228');
  const own = design.vd;
  const origin = fromOrigin(own, vdOrigin);
  if (origin === null) return notVerified(id, () => `${own.basis}; the drop of a feeding circuit between the origin and this board is not known`);
  const limit = design.vdLimit.percent;
  const ok = origin.percent <= limit;
  const words = () => (origin.legs.length === 0 ? own.basis : `${own.basis}; ${originWords(origin, own.percent)}`);
  return result(id, ok ? 'pass' : 'fail', () => `${words()} ${ok ? '≤' : '>'} ${design.vdLimit.basis}`, { value: toPlaces(origin.percent, 2), limit, unit: '%' });
};

/**
 * The drop only worsens as the run grows: the circuit's own drop grows with the length, the drop
 * up to its board and the limit do not. Its margin is the limit less the drop from the origin, in
 * per cent (see LengthCheck).
 */
export const voltageDropCheck: LengthCheck = Object.assign(judge, {
  worsensWithLength: true as const,
  margin: ({ design, vdOrigin }: CircuitContext): number | null => {
    const origin = design.vd && fromOrigin(design.vd, vdOrigin);
    return origin ? design.vdLimit.percent - origin.percent : null;
  },
});
