// Disconnection: at the design earth fault current the device giving fault protection must open
// within the required time (IEC 60364-4-41 Table 41.1, 411.3.2): the overcurrent device by the
// slowest edge of its characteristic, or on a TT supply the RCD by its break time (411.5).
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { notVerified, result } from './result.js';

export const disconnection: Check = ({ derived, fault, requiredBasis }) => {
  const id = 'disconnection';
  const required = derived.required_disconnect_s;
  if (!fault.known) return notVerified(id, `no design fault current: ${fault.why}`);
  if (!fault.device_known) return notVerified(id, `${fault.basis}; the device library has no characteristic for ${fault.opener}`);
  const numbers = { value: fault.time_s, limit: required, unit: 's' };
  if (fault.time_s === null) {
    return result(id, 'fail', `${fault.basis}: ${fault.opener} is not known to operate at this current (${fault.timeBasis}); required within ${fmt(required)} s (${requiredBasis})`, numbers);
  }
  const ok = fault.time_s <= required;
  return result(id, ok ? 'pass' : 'fail',
    `${fault.basis}: ${fault.opener} opens within ${fmt(fault.time_s)} s (${fault.timeBasis}) ${ok ? '≤' : '>'} ${fmt(required)} s required (${requiredBasis})`, numbers);
};
