// Values as the pack and the terminal show them: readings with their units, a check's value
// against its limit, a re-tested check's verdicts in one line.
import type { CheckResult } from '../calc/types.js';
import { MEASURED, type MeasuredField } from '../model/schema.js';
import { fmt, symbolOf, type Reading } from '../model/units.js';
import { CHECK_QUANTITY } from './labels.js';
import { STATUS_LOOK } from './status.js';

/** The symbols of the units check results carry. */
export const UNIT_SYMBOL: Record<string, string> = { ohm: 'Ω', Mohm: 'MΩ', ms: 'ms', V: 'V', mm2: 'mm²', A: 'A', kA: 'kA', s: 's', '%': '%', m: 'm' };

const unitOf = (k: Pick<CheckResult, 'unit'>): string => (k.unit === null ? '' : ` ${UNIT_SYMBOL[k.unit] ?? k.unit}`);

/** A re-tested check in one line: "1.62 Ω on 2026-11-13 (fail), re-tested 0.71 Ω on 2026-11-20 (pass)". */
export function historyLine(k: CheckResult): string | null {
  if (!k.history) return null;
  const unit = unitOf(k);
  return k.history.map((h, i) => {
    const value = h.value === null ? '' : `${h.over_range ? '>' : ''}${fmt(h.value)}${unit} `;
    return `${i === 0 ? '' : 're-tested '}${value}on ${h.date} (${STATUS_LOOK[h.status].word})`;
  }).join(', ');
}

/** A reading with its unit: "0.84 Ω", ">999 MΩ", "n/a", "not-tested". */
export function showReading(field: MeasuredField, r: Reading): string {
  const unit = symbolOf(MEASURED[field]);
  switch (r.kind) {
    case 'value': return `${fmt(r.value)} ${unit}`;
    case 'at-least': return `>${fmt(r.value)} ${unit}`;
    default: return r.kind;
  }
}

/** A reading without its unit (the column names it): "0.84", ">999", "n/a", "not tested". */
export function bareReading(r: Reading | string): string {
  if (typeof r === 'string') return r === 'not-tested' ? 'not tested' : r;
  switch (r.kind) {
    case 'value': return fmt(r.value);
    case 'at-least': return `>${fmt(r.value)}`;
    default: return r.kind === 'not-tested' ? 'not tested' : r.kind;
  }
}

/**
 * A check's value against its limit in a few words, the sign chosen by the numbers so it always
 * reads true: "measured Zs 0.54 Ω ≤ limit 1.09 Ω". Null where the check has no pair of numbers.
 */
export function comparison(k: CheckResult): string | null {
  if (k.value === null || k.limit === null) return null;
  const q = CHECK_QUANTITY[k.id] ?? { value: 'value', limit: 'limit' };
  const unit = unitOf(k);
  const value = `${k.over_range ? '>' : ''}${fmt(k.value)}${unit}`;
  const limit = `${q.limit} ${fmt(k.limit)}${unit}`;
  // an over-range value below its limit says nothing about how they compare: no sign at all
  if (k.over_range && k.value < k.limit) return `${q.value} ${value}; ${limit}`;
  const op = k.value < k.limit ? '≤' : k.value > k.limit || k.over_range ? '≥' : '=';
  return `${q.value} ${value} ${op} ${limit}`;
}
