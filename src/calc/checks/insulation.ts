// Insulation resistance: the lower of L–L and L–E against the minimum for the circuit's voltage
// band at that band's test voltage (IEC 60364-6 Table 6.1 / 6A). An over-range reading (">999")
// is a lower bound and passes when the bound does. Below 2 MΩ is queried (common practice).
import type { Check } from '../types.js';
import type { Reading } from '../../model/units.js';
import { fmt } from '../../model/units.js';
import { INSULATION_MINIMUMS, INSULATION_QUERY_BELOW_MOHM } from '../../reference/insulation.js';
import { notVerified, result, unusable } from './result.js';

export const insulation: Check = ({ circuit, supply, readings }) => {
  const id = 'insulation';
  const circuitV = circuit.phases === 3 ? Math.round(supply.u0_v * Math.sqrt(3)) : supply.u0_v;
  const band = INSULATION_MINIMUMS.find((b) => circuitV <= b.circuit_upto_v);
  if (!band) return notVerified(id, `no insulation minimum for a ${circuitV} V circuit in IEC 60364-6 Table 6.1`);

  const le = readings.ir_le_mohm;
  const ll = readings.ir_ll_mohm;
  const leMissing = unusable(id, 'insulation resistance L–E', le);
  if (leMissing) return leMissing;
  // L–L may be n/a (e.g. equipment left connected that must not be tested), with a reason.
  const llUsable = ll && (ll.value.kind === 'value' || ll.value.kind === 'at-least');
  if (!llUsable && !(ll?.value.kind === 'n/a' && readings.notes)) {
    return unusable(id, 'insulation resistance L–L', ll) ?? notVerified(id, 'insulation resistance L–L marked n/a with no reason in notes');
  }
  const testV = readings.ir_test_v;
  if (!testV || testV.value.kind !== 'value') return notVerified(id, 'the insulation test voltage is not recorded (ir_test_v)');
  const dates = [le!.date, ...(llUsable ? [ll!.date] : [])].sort();
  const date = dates[dates.length - 1]!;
  if (testV.value.value < band.test_v) {
    return result(id, 'fail', `tested at ${testV.value.value} V d.c.; a circuit ${band.band} is tested at ${band.test_v} V d.c. (IEC 60364-6 Table 6.1)`, { date });
  }
  const candidates = [le!.value, ...(llUsable ? [ll!.value] : [])] as Extract<Reading, { value: number }>[];
  const lowest = candidates.reduce((a, b) => (b.value < a.value ? b : a));
  const shown = `${lowest.kind === 'at-least' ? '>' : ''}${fmt(lowest.value)} MΩ`;
  const which = candidates.length === 2 ? 'lower of L–L and L–E' : 'L–E (L–L n/a)';
  const rule = `minimum ${band.min_mohm} MΩ at ${band.test_v} V d.c. for a circuit ${band.band} (IEC 60364-6 Table 6.1)`;
  const numbers = { value: lowest.value, limit: band.min_mohm, unit: 'Mohm', date };
  if (lowest.value < band.min_mohm) {
    return lowest.kind === 'at-least'
      ? result(id, 'not-verified', `${which} ${shown} (over range) cannot show the ${rule}`, numbers)
      : result(id, 'fail', `${which} ${shown} < ${rule}`, numbers);
  }
  if (lowest.value < INSULATION_QUERY_BELOW_MOHM) {
    return result(id, 'attention', `${which} ${shown} meets the ${rule}, but is below ${INSULATION_QUERY_BELOW_MOHM} MΩ and is worth investigating (common practice)`, numbers);
  }
  return result(id, 'pass', `${which} ${shown} ≥ ${rule}`, numbers);
};
