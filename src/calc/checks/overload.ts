// Overload protection: Ib ≤ In ≤ Iz (IEC 60364-4-43, 433.1). A semi-enclosed (BS 3036) fuse is not
// guaranteed to open below about 2 In, so it needs In ≤ 0.725 Iz (= 1.45 / 2; BS 7671 433.1.202).
// A ring final circuit (BS 7671 433.1.204): on a 30 A or 32 A device with copper live conductors
// of at least 2.5 mm², it is deemed protected against overload where Iz ≥ 20 A. A ring outside
// those conditions is judged as any circuit, In ≤ Iz of its cable.
import type { Check } from '../types.js';
import { fmt, toPlaces } from '../../model/units.js';
import { notVerified, result } from './result.js';
import { RING_RULE } from '../../reference/ring.js';

const SEMI_ENCLOSED = 0.725;

export const overload: Check = ({ circuit, design }) => {
  const id = 'overload';
  if (!design.capacity.ok) return notVerified(id, `no Iz: ${design.capacity.message}`);
  const { iz_a: iz, basis } = design.capacity.capacity;
  const ib = circuit.ib_a;
  const inA = circuit.rating_a;
  const numbers = { value: inA, unit: 'A' };
  if (ib > inA) return result(id, 'fail', `Ib ${fmt(ib)} A > In ${fmt(inA)} A: the device is smaller than the design current; ${basis}`, { ...numbers, limit: ib });
  const ringRule = circuit.ring && (RING_RULE.device_ratings_a as readonly number[]).includes(inA)
    && circuit.conductor === RING_RULE.material && circuit.live_mm2 >= RING_RULE.min_live_mm2;
  if (ringRule) {
    const ok = iz >= RING_RULE.min_iz_a;
    const words = `${basis}; ring final circuit on a ${fmt(inA)} A device, ${fmt(circuit.live_mm2)} mm² copper: Ib ${fmt(ib)} A ≤ In ${fmt(inA)} A, Iz ${fmt(iz)} A ${ok ? '≥' : '<'} ${RING_RULE.min_iz_a} A (${RING_RULE.clause})`;
    return result(id, ok ? 'pass' : 'fail', words, { ...numbers, limit: RING_RULE.min_iz_a });
  }
  const ringNote = circuit.ring
    ? ` (a ring outside ${RING_RULE.clause} — ${RING_RULE.device_ratings_a.join(' or ')} A device, copper live conductors of at least ${RING_RULE.min_live_mm2} mm² — is judged as any circuit)`
    : '';
  if (circuit.device === 'fuse:bs3036') {
    const limit = SEMI_ENCLOSED * iz;
    const ok = inA <= limit;
    const words = `${basis}; semi-enclosed fuse: Ib ${fmt(ib)} A ≤ In ${fmt(inA)} A ${ok ? '≤' : '>'} 0.725 × Iz = ${fmt(limit)} A (BS 7671 433.1.202)${ringNote}`;
    return result(id, ok ? 'pass' : 'fail', words, { ...numbers, limit: toPlaces(limit, 2) });
  }
  const ok = inA <= iz;
  return result(id, ok ? 'pass' : 'fail', `${basis}; Ib ${fmt(ib)} A ≤ In ${fmt(inA)} A ${ok ? '≤' : '>'} Iz ${fmt(iz)} A (IEC 60364-4-43, 433.1)${ringNote}`, { ...numbers, limit: toPlaces(iz, 2) });
};
