// Insulation resistance: the lower of L–L and L–E against the minimum for the circuit's voltage
// band at that band's test voltage (IEC 60364-6 Table 6.1 / 6A). An over-range reading (">999")
// is a lower bound and passes when the bound does. A test made below the band's test voltage
// fails, saying so — except 250 V d.c. on a circuit up to 500 V, allowed where surge protective
// devices or other equipment cannot be disconnected (BS 7671 643.3; IEC 60364-6, 6.4.3.3), with a
// minimum of 1 MΩ: `attention`, never a pass. Below 2 MΩ is queried (common practice).
import type { Check, CheckResult } from '../types.js';
import { INSULATION_MINIMUMS, INSULATION_QUERY_BELOW_MOHM, REDUCED_TEST, type InsulationBand } from '../../reference/insulation.js';
import { INSULATION_TEST_NOMINAL_V } from '../../reference/plausibility.js';
import { inSession, type SessionValue } from '../../model/readings.js';
import type { Reading } from '../../model/units.js';
import { circuitVoltage } from '../circuit-facts.js';
import { latest, notVerified, numberOf, reasonFor, result, shown, unusable, type Numeric } from './result.js';

const id = 'insulation';

/** The tester's nominal voltage a recorded test voltage was made at: its output is at or above the nominal (IEC 61557-2). */
const nominalOf = (v: number): number => [...INSULATION_TEST_NOMINAL_V].reverse().find((n) => v >= n) ?? v;

/**
 * A reading below the band's minimum fails whatever voltage it was made at: the minimum is no lower
 * at the band's test voltage, nor at the reduced test, nor at a higher one (IEC 60364-6 Table 6.1).
 */
function belowAtAnyVoltage(judged: readonly { name: string; m: SessionValue<Reading> }[], band: InsulationBand): CheckResult | null {
  for (const { name, m } of judged) {
    const r = numberOf(m);
    if (r.kind === 'value' && r.value < band.min_mohm) {
      return result(id, 'fail', `${name} ${shown(r, 'MΩ')} < minimum ${band.min_mohm} MΩ for a circuit ${band.band}, at any test voltage (IEC 60364-6 Table 6.1); no test voltage (ir_test_v) recorded with it on ${m.date}`,
        { value: r.value, limit: band.min_mohm, unit: 'Mohm', date: m.date });
    }
  }
  return null;
}

export const insulation: Check = ({ circuit, supply, readings }) => {
  const circuitV = circuitVoltage(circuit.phases, supply.u0_v);
  const band = INSULATION_MINIMUMS.find((b) => circuitV <= b.circuit_upto_v);
  if (!band) return notVerified(id, `no insulation minimum for a ${circuitV} V circuit in IEC 60364-6 Table 6.1`);

  const le = readings.ir_le_mohm;
  const ll = readings.ir_ll_mohm;
  const leMissing = unusable(id, 'insulation resistance L–E', le);
  if (leMissing) return leMissing;
  // L–L may be n/a (e.g. equipment left connected that must not be tested), with a reason in the
  // notes of the same session
  const llUsable = ll !== undefined && (ll.value.kind === 'value' || ll.value.kind === 'at-least');
  if (!llUsable && !(ll?.value.kind === 'n/a' && reasonFor(readings.notes, ll) !== undefined)) {
    return ll?.value.kind === 'n/a'
      ? result(id, 'not-verified', `insulation resistance L–L marked n/a on ${ll.date} with no reason in that session's notes`, { date: ll.date })
      : unusable(id, 'insulation resistance L–L', ll)!;
  }
  // each reading was made at the voltage its own session records: a re-test may have used another,
  // and a voltage left blank in it is not the one an earlier session gave
  const judged: { name: string; m: SessionValue<Reading> }[] = [{ name: 'L–E', m: le! }, ...(llUsable ? [{ name: 'L–L', m: ll }] : [])];
  let testV: SessionValue<Reading> | undefined;
  for (const { name, m } of judged) {
    const v = inSession(readings.ir_test_v, m.file);
    const missing = v ? unusable(id, `insulation test voltage (ir_test_v) of the ${name} reading`, v) : notVerified(id, `no insulation test voltage (ir_test_v) recorded with the ${name} reading of ${m.date}`);
    if (missing) return belowAtAnyVoltage(judged, band) ?? missing;
    // the lower voltage is the weaker test: it decides
    if (!testV || numberOf(v!).value < numberOf(testV).value) testV = v;
  }
  const volts: Numeric = numberOf(testV!);
  const nominal = nominalOf(volts.value);
  const date = latest([...judged.map((j) => j.m.date), testV!.date, ...(ll !== undefined && !llUsable ? [ll.date] : [])])!;
  const rule = `minimum ${band.min_mohm} MΩ at ${band.test_v} V d.c. for a circuit ${band.band} (IEC 60364-6 Table 6.1)`;
  const reduced = nominal === REDUCED_TEST.test_v && band.test_v === REDUCED_TEST.for_band_test_v;
  if (reduced) {
    const all = judged.map((j) => numberOf(j.m));
    const lowestReduced = all.find((c) => c.kind === 'value' && c.value < REDUCED_TEST.min_mohm) ?? all.reduce((a, b) => (b.value < a.value ? b : a));
    const numbers = { value: lowestReduced.value, over_range: lowestReduced.kind === 'at-least', limit: REDUCED_TEST.min_mohm, unit: 'Mohm', date };
    const at = volts.value === nominal ? `${nominal} V d.c.` : `${shown(volts, 'V')} d.c. (a ${nominal} V test)`;
    const words = `tested at ${at} instead of ${band.test_v} V: allowed where surge protective devices or other equipment cannot be disconnected, minimum ${REDUCED_TEST.min_mohm} MΩ (${REDUCED_TEST.clause})`;
    if (lowestReduced.kind === 'value' && lowestReduced.value < REDUCED_TEST.min_mohm) return result(id, 'fail', `${shown(lowestReduced, 'MΩ')} < ${REDUCED_TEST.min_mohm} MΩ; ${words}`, numbers);
    if (lowestReduced.value < REDUCED_TEST.min_mohm) return result(id, 'not-verified', `${shown(lowestReduced, 'MΩ')} (over range) cannot show ≥ ${REDUCED_TEST.min_mohm} MΩ; ${words}`, numbers);
    return result(id, 'attention', `${shown(lowestReduced, 'MΩ')} ≥ ${REDUCED_TEST.min_mohm} MΩ, ${words}; record why the ${band.test_v} V test could not be made`, numbers);
  }
  if (nominal < band.test_v) {
    const words = `tested at ${shown(volts, 'V')} d.c.; a circuit ${band.band} is tested at ${band.test_v} V d.c. (IEC 60364-6 Table 6.1)`;
    return result(id, volts.kind === 'value' ? 'fail' : 'not-verified', words, { value: volts.value, over_range: volts.kind === 'at-least', limit: band.test_v, unit: 'V', date });
  }
  const candidates = judged.map((j) => numberOf(j.m));
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
