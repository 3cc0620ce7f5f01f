// Overload protection: Ib ≤ In ≤ Iz (IEC 60364-4-43, 433.1). A semi-enclosed (BS 3036) fuse is not
// guaranteed to open below about 2 In, so it needs In ≤ 0.725 Iz (= 1.45 / 2; BS 7671 433.1.202).
// A ring final circuit shares its load between two legs: Iz ≥ 0.67 In (BS 7671 433.1.204, common practice).
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { notVerified, result } from './result.js';

const SEMI_ENCLOSED = 0.725;
const RING_SHARE = 0.67;

export const overload: Check = ({ circuit, design }) => {
  const id = 'overload';
  if (!design.capacity.ok) return notVerified(id, `no Iz: ${design.capacity.message}`);
  const { iz_a: iz, basis } = design.capacity.capacity;
  const ib = circuit.ib_a;
  const inA = circuit.rating_a;
  const numbers = { value: inA, unit: 'A' };
  if (ib > inA) return result(id, 'fail', `Ib ${fmt(ib)} A > In ${fmt(inA)} A: the device is smaller than the design current; ${basis}`, { ...numbers, limit: ib });
  if (circuit.device === 'fuse:bs3036') {
    const limit = SEMI_ENCLOSED * iz;
    const ok = inA <= limit;
    const words = `${basis}; semi-enclosed fuse: Ib ${fmt(ib)} A ≤ In ${fmt(inA)} A ${ok ? '≤' : '>'} 0.725 × Iz = ${fmt(limit)} A (BS 7671 433.1.202)`;
    return result(id, ok ? 'pass' : 'fail', words, { ...numbers, limit: Number(limit.toFixed(2)) });
  }
  if (circuit.ring) {
    const limit = iz / RING_SHARE;
    const ok = inA <= limit;
    const words = `${basis}; ring final circuit: Ib ${fmt(ib)} A ≤ In ${fmt(inA)} A, Iz ${fmt(iz)} A ${ok ? '≥' : '<'} 0.67 × In = ${fmt(RING_SHARE * inA)} A (BS 7671 433.1.204, common practice)`;
    return result(id, ok ? 'pass' : 'fail', words, { ...numbers, limit: Number(limit.toFixed(2)) });
  }
  const ok = inA <= iz;
  return result(id, ok ? 'pass' : 'fail', `${basis}; Ib ${fmt(ib)} A ≤ In ${fmt(inA)} A ${ok ? '≤' : '>'} Iz ${fmt(iz)} A (IEC 60364-4-43, 433.1)`, { ...numbers, limit: Number(iz.toFixed(2)) });
};
