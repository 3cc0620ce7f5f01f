// Voltage drop against the rule set's limit (lighting 3 %, other uses 5 %; IEC 60364-5-52 Annex G).
import type { Check } from '../types.js';
import { notVerified, result } from './result.js';

export const voltageDropCheck: Check = ({ design }) => {
  const id = 'voltage-drop';
  if (!design.vd) return notVerified(id, 'no conductor resistance for this size and material in IEC 60228');
  const { percent, basis } = design.vd;
  const limit = design.vdLimit.percent;
  const ok = percent <= limit;
  return result(id, ok ? 'pass' : 'fail', `${basis} ${ok ? '≤' : '>'} ${design.vdLimit.basis}`, { value: Number(percent.toFixed(2)), limit, unit: '%' });
};
