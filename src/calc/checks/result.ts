// Small constructors for check results, so each check reads as its rule.
import type { CheckId, CheckResult, Status } from '../types.js';
import type { Reading } from '../../model/units.js';
import type { Measured } from '../../model/readings.js';

export function result(
  id: CheckId, status: Status, basis: string,
  numbers: { value?: number | null; limit?: number | null; unit?: string | null; date?: string } = {},
): CheckResult {
  const r: CheckResult = { id, status, value: numbers.value ?? null, limit: numbers.limit ?? null, unit: numbers.unit ?? null, basis };
  if (numbers.date !== undefined) r.date = numbers.date;
  return r;
}

export const notVerified = (id: CheckId, why: string): CheckResult => result(id, 'not-verified', why);
export const notApplicable = (id: CheckId, why: string): CheckResult => result(id, 'n/a', why);

/** A reading that cannot be judged: missing, not tested, or n/a where a value is needed. */
export function unusable(id: CheckId, name: string, m: Measured<Reading> | undefined): CheckResult | null {
  if (!m) return notVerified(id, `no ${name} recorded in any test session`);
  if (m.value.kind === 'not-tested') return result(id, 'not-verified', `${name} marked not tested on ${m.date}`, { date: m.date });
  if (m.value.kind === 'n/a') return result(id, 'not-verified', `${name} marked n/a on ${m.date}; this circuit needs it`, { date: m.date });
  return null;
}
