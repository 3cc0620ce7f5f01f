// Insulation resistance: the lower of L–L and L–E against the minimum for the circuit's voltage
// band at that band's test voltage (IEC 60364-6 Table 6.1 / 6A). An over-range reading (">999")
// is a lower bound and passes when the bound does. A test made below the band's test voltage
// fails, saying so — except 250 V d.c. on a circuit up to 500 V, allowed where surge protective
// devices or other equipment cannot be disconnected (BS 7671 643.3; IEC 60364-6, 6.4.3.3), with a
// minimum of 1 MΩ: `attention`, never a pass. Below 2 MΩ is queried (common practice).
import type { Check } from '../types.js';
import { INSULATION_MINIMUMS, INSULATION_QUERY_BELOW_MOHM, REDUCED_TEST } from '../../reference/insulation.js';
import { circuitVoltage } from '../circuit-facts.js';
import { latest, notVerified, numberOf, result, shown, unusable } from './result.js';

const id = 'insulation';

export const insulation: Check = ({ circuit, supply, readings }) => {
  const circuitV = circuitVoltage(circuit.phases, supply.u0_v);
  const band = INSULATION_MINIMUMS.find((b) => circuitV <= b.circuit_upto_v);
  if (!band) return notVerified(id, `no insulation minimum for a ${circuitV} V circuit in IEC 60364-6 Table 6.1`);

  const le = readings.ir_le_mohm;
  const ll = readings.ir_ll_mohm;
  const leMissing = unusable(id, 'insulation resistance L–E', le);
  if (leMissing) return leMissing;
  // L–L may be n/a (e.g. equipment left connected that must not be tested), with a reason.
  const llUsable = ll !== undefined && (ll.value.kind === 'value' || ll.value.kind === 'at-least');
  if (!llUsable && !(ll?.value.kind === 'n/a' && readings.notes)) {
    return unusable(id, 'insulation resistance L–L', ll) ?? notVerified(id, 'insulation resistance L–L marked n/a with no reason in notes');
  }
  const testV = readings.ir_test_v;
  const testMissing = unusable(id, 'insulation test voltage (ir_test_v)', testV);
  if (testMissing) return testMissing;
  const volts = numberOf(testV!);
  const date = latest([le!.date, testV!.date, ...(llUsable ? [ll.date] : [])])!;
  const rule = `minimum ${band.min_mohm} MΩ at ${band.test_v} V d.c. for a circuit ${band.band} (IEC 60364-6 Table 6.1)`;
  const reduced = volts.kind === 'value' && volts.value === REDUCED_TEST.test_v && band.test_v === REDUCED_TEST.for_band_test_v;
  if (reduced) {
    const all = [numberOf(le!), ...(llUsable ? [numberOf(ll)] : [])];
    const lowestReduced = all.find((c) => c.kind === 'value' && c.value < REDUCED_TEST.min_mohm) ?? all.reduce((a, b) => (b.value < a.value ? b : a));
    const numbers = { value: lowestReduced.value, over_range: lowestReduced.kind === 'at-least', limit: REDUCED_TEST.min_mohm, unit: 'Mohm', date };
    const words = `tested at ${REDUCED_TEST.test_v} V d.c. instead of ${band.test_v} V: allowed where surge protective devices or other equipment cannot be disconnected, minimum ${REDUCED_TEST.min_mohm} MΩ (${REDUCED_TEST.clause})`;
    if (lowestReduced.kind === 'value' && lowestReduced.value < REDUCED_TEST.min_mohm) return result(id, 'fail', `${shown(lowestReduced, 'MΩ')} < ${words}`, numbers);
    if (lowestReduced.value < REDUCED_TEST.min_mohm) return result(id, 'not-verified', `${shown(lowestReduced, 'MΩ')} (over range) cannot show ≥ ${REDUCED_TEST.min_mohm} MΩ; ${words}`, numbers);
    return result(id, 'attention', `${shown(lowestReduced, 'MΩ')} ≥ ${REDUCED_TEST.min_mohm} MΩ, ${words}; record why the ${band.test_v} V test could not be made`, numbers);
  }
  if (volts.value < band.test_v) {
    const words = `tested at ${shown(volts, 'V')} d.c.; a circuit ${band.band} is tested at ${band.test_v} V d.c. (IEC 60364-6 Table 6.1)`;
    return result(id, volts.kind === 'value' ? 'fail' : 'not-verified', words, { value: volts.value, over_range: volts.kind === 'at-least', limit: band.test_v, unit: 'V', date });
  }
  const candidates = [numberOf(le!), ...(llUsable ? [numberOf(ll)] : [])];
  const lowest = candidates.reduce((a, b) => (b.value < a.value ? b : a));
  const what = candidates.length === 2 ? 'lower of L–L and L–E' : 'L–E (L–L n/a)';
  const which = `${what} ${shown(lowest, 'MΩ')} at ${shown(volts, 'V')}`;
  const numbers = { value: lowest.value, over_range: lowest.kind === 'at-least', limit: band.min_mohm, unit: 'Mohm', date };
  // a reading below the minimum fails, even where the other is an over-range bound below it too
  const below = candidates.find((c) => c.kind === 'value' && c.value < band.min_mohm);
  if (below) return result(id, 'fail', `${what} ${shown(below, 'MΩ')} at ${shown(volts, 'V')} < ${rule}`, { ...numbers, value: below.value, over_range: false });
  if (lowest.value < band.min_mohm) return result(id, 'not-verified', `${which} (over range) cannot show the ${rule}`, numbers);
  if (lowest.value < INSULATION_QUERY_BELOW_MOHM) {
    return result(id, 'attention', `${which} meets the ${rule}, but is below ${INSULATION_QUERY_BELOW_MOHM} MΩ and is worth investigating (common practice)`, numbers);
  }
  return result(id, 'pass', `${which} ≥ ${rule}`, numbers);
};
