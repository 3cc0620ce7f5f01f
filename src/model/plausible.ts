// Whether a value (in its field's unit) is one anyone could have measured: the ranges of
// src/reference/plausibility.ts. Outside, the value is an input error naming the range and why.
import { INSULATION_TEST_MAX_FACTOR, INSULATION_TEST_NOMINAL_V, PLAUSIBLE } from '../reference/plausibility.js';
import { fmt } from './units.js';

/** The problem with `value` in `field`, or null when it is plausible (or the field has no range). */
export function implausible(field: string, value: number, written: string): string | null {
  const r = PLAUSIBLE[field];
  if (!r) return null;
  const out = !Number.isFinite(value)
    || (r.above !== undefined && !(value > r.above))
    || (r.atLeast !== undefined && !(value >= r.atLeast))
    || value > r.atMost;
  if (out) {
    const range = `${r.above !== undefined ? `above ${fmt(r.above)}` : `from ${fmt(r.atLeast ?? 0)}`} to ${fmt(r.atMost)} ${r.unit}`;
    return `found "${written}", which is not a plausible ${field} (${range}): ${r.why}`;
  }
  if (field === 'ir_test_v') {
    const fits = INSULATION_TEST_NOMINAL_V.some((v) => value >= v && value <= v * INSULATION_TEST_MAX_FACTOR);
    if (!fits) return `found "${written}", which is not an insulation test voltage: ${r.why}`;
  }
  return null;
}
