// Protective conductor size by the adiabatic equation S = √(I²t) / k (IEC 60364-5-54, 543.1.2),
// for the design earth fault at the far end of the circuit, with the I²t of the device that opens
// and k by conductor, insulation and whether the cpc is a core of the cable. The equation holds
// for disconnection within 5 s.
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { ADIABATIC_LIMIT_S, kFor } from '../design/k-factor.js';
import { notVerified, result } from './result.js';

export const adiabatic: Check = ({ circuit, fault }) => {
  const id = 'adiabatic';
  if (!fault.known) return notVerified(id, `no design fault current: ${fault.why}`);
  if (!fault.device_known) return notVerified(id, `${fault.basis}; the device library has no characteristic for ${fault.opener}`);
  if (!fault.energy || fault.time_s === null || fault.time_s > ADIABATIC_LIMIT_S) {
    return result(id, 'fail', `${fault.basis}: ${fault.opener} ${fault.time_s === null ? 'is not known to operate' : `takes ${fmt(fault.time_s)} s`}; the adiabatic equation needs disconnection within ${ADIABATIC_LIMIT_S} s (IEC 60364-5-54, 543.1.2)`, { value: circuit.cpc_mm2, unit: 'mm2' });
  }
  const k = kFor(circuit.conductor, circuit.insulation, circuit.cpc_in_cable);
  const s = Math.sqrt(fault.energy.i2t_a2s) / k.k;
  const ok = circuit.cpc_mm2 >= s;
  return result(id, ok ? 'pass' : 'fail',
    `${fault.basis}; ${fault.energy.basis}; S = √(I²t) / ${k.basis} = ${fmt(s)} mm²; cpc ${fmt(circuit.cpc_mm2)} mm² ${ok ? '≥' : '<'} ${fmt(s)} mm²`,
    { value: circuit.cpc_mm2, limit: Number(s.toFixed(3)), unit: 'mm2' });
};
