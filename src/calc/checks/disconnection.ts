// Disconnection: at the design earth fault current the device must open (slowest edge of its
// characteristic) within the required time (IEC 60364-4-41 Table 41.1, 411.3.2).
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { notVerified, result } from './result.js';

export const disconnection: Check = ({ circuit, derived, fault, requiredBasis }) => {
  const id = 'disconnection';
  const required = derived.required_disconnect_s;
  const what = `${circuit.device} ${fmt(circuit.rating_a)} A`;
  if (!fault.known) return notVerified(id, `no design fault current: ${fault.why}`);
  if (!fault.device_known) return notVerified(id, `${fault.basis}; the device library has no characteristic for ${what}`);
  const numbers = { value: fault.time_s, limit: required, unit: 's' };
  if (fault.time_s === null) {
    return result(id, 'fail', `${fault.basis}: ${what} is not known to operate at this current at all; required within ${fmt(required)} s (${requiredBasis})`, numbers);
  }
  const ok = fault.time_s <= required;
  return result(id, ok ? 'pass' : 'fail',
    `${fault.basis}: ${what} opens within ${fmt(fault.time_s)} s (slowest edge) ${ok ? '≤' : '>'} ${fmt(required)} s required (${requiredBasis})`, numbers);
};
