// Breaking capacity: the prospective fault current at the board (fault-level.ts: the three-phase
// value for a three-phase circuit) must not exceed the device's rated breaking capacity
// (IEC 60364-4-43, 434.5.1). The capacity is the circuit's breaking_ka; without it, the capacity the
// job declares for the devices of this code (rules.devices) is an assumption, printed, and the
// verdict is at best `attention`; with neither it is not verified — never a capacity guessed.
import type { Check } from '../types.js';
import { fmt, toPlaces } from '../../model/units.js';
import { breakingLevel } from '../fault-level.js';
import { notVerified, result } from './result.js';

const id = 'breaking-capacity';
const RULE = 'IEC 60364-4-43, 434.5.1';

export const breakingCapacity: Check = ({ circuit, board, supply, rules }) => {
  const level = breakingLevel(circuit, board, supply);
  if (!level) return notVerified(id, `no prospective fault current recorded for ${board.id} or at the origin`);
  const ka = level.amps / 1000;
  const numbers = (limit: number) => ({ value: toPlaces(ka, 3), limit, unit: 'kA' });
  const given = circuit.breaking_ka;
  if (given !== undefined) {
    const ok = ka <= given;
    return result(id, ok ? 'pass' : 'fail', `${level.basis} ${ok ? '≤' : '>'} rated breaking capacity ${fmt(given)} kA (${RULE})`, numbers(given));
  }
  const declared = rules.devices[circuit.device]?.breaking_ka;
  if (declared === undefined) {
    return result(id, 'not-verified', `${level.basis}; the device's rated breaking capacity is not recorded (breaking_ka in circuits.csv, or rules.devices in project.yaml)`, { value: toPlaces(ka, 3), unit: 'kA' });
  }
  const ok = ka <= declared;
  return result(id, ok ? 'attention' : 'fail',
    `${level.basis} ${ok ? '≤' : '>'} ${fmt(declared)} kA, assumed from the range of devices the job declares for ${circuit.device} (rules.devices; breaking_ka not given for this circuit) (${RULE})`, numbers(declared));
};
