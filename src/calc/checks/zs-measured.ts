// Measured Zs against measured_zs_factor × max Zs: the factor allows for the conductors being
// hotter in service than when tested (0.8 by default, common practice).
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { notVerified, result, unusable } from './result.js';

export const zsMeasured: Check = ({ readings, derived, rules, maxZsBasis }) => {
  const m = readings.zs_ohm;
  const missing = unusable('zs-measured', 'measured Zs', m);
  if (missing) return missing;
  if (derived.max_zs_ohm === null) return notVerified('zs-measured', `no max Zs to compare with: ${maxZsBasis}`);
  const limit = rules.measured_zs_factor * derived.max_zs_ohm;
  const zs = m!.value.kind === 'value' || m!.value.kind === 'at-least' ? m!.value.value : NaN;
  const rule = `${rules.measured_zs_factor} × max Zs ${fmt(derived.max_zs_ohm)} Ω = ${fmt(limit)} Ω (${maxZsBasis})`;
  const numbers = { value: zs, limit: Number(limit.toFixed(3)), unit: 'ohm', date: m!.date };
  if (m!.value.kind === 'at-least') {
    return zs > limit
      ? result('zs-measured', 'fail', `measured Zs above ${fmt(zs)} Ω (over range) > ${rule}`, numbers)
      : result('zs-measured', 'not-verified', `measured Zs over range (> ${fmt(zs)} Ω): cannot show ≤ ${rule}`, numbers);
  }
  const margin = limit - zs;
  return zs <= limit
    ? result('zs-measured', 'pass', `measured Zs ${fmt(zs)} Ω ≤ ${rule}; margin ${fmt(margin)} Ω`, numbers)
    : result('zs-measured', 'fail', `measured Zs ${fmt(zs)} Ω > ${rule}; over by ${fmt(-margin)} Ω`, numbers);
};
