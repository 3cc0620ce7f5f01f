// Breaking capacity: the prospective fault current at the board (measured there, else the one at
// the origin, which is no lower) must not exceed the device's rated breaking capacity
// (IEC 60364-4-43, 434.5.1). Where circuits.csv gives none, the family's usual capacity is taken
// and the basis says so.
import type { Check } from '../types.js';
import { deviceFamily } from '../devices/index.js';
import { fmt } from '../../model/units.js';
import { notVerified, result } from './result.js';

export const breakingCapacity: Check = ({ circuit, board, supply }) => {
  const id = 'breaking-capacity';
  const pfc = board.pfc_ka ?? supply.pfc_ka;
  if (pfc === undefined) return notVerified(id, `no prospective fault current recorded for ${board.id} or at the origin`);
  const where = board.pfc_ka !== undefined ? `at ${board.id}` : `at the origin (none recorded for ${board.id}; it is no lower upstream)`;
  const given = circuit.breaking_ka;
  const capacity = given ?? deviceFamily(circuit.device).breaking_ka;
  const whose = given !== undefined ? `rated ${fmt(capacity)} kA` : `${fmt(capacity)} kA, the usual capacity of ${circuit.device} (breaking_ka not given)`;
  const ok = pfc <= capacity;
  return result(id, ok ? 'pass' : 'fail', `prospective fault current ${fmt(pfc)} kA ${where} ${ok ? '≤' : '>'} breaking capacity ${whose} (IEC 60364-4-43, 434.5.1)`, {
    value: pfc, limit: capacity, unit: 'kA',
  });
};
