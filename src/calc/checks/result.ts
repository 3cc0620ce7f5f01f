// Small constructors for check results, so each check reads as its rule.
import type { CheckId, CheckResult, Status } from '../types.js';
import { fmt, type Reading } from '../../model/units.js';
import { inSession, type Measured, type SessionValue } from '../../model/readings.js';
import { withBasis, type Words } from '../basis.js';

export function result(
  id: CheckId, status: Status, basis: Words,
  numbers: { value?: number | null; limit?: number | null; unit?: string | null; date?: string; over_range?: boolean } = {},
): CheckResult {
  const r: CheckResult = withBasis({ id, status, value: numbers.value ?? null, limit: numbers.limit ?? null, unit: numbers.unit ?? null }, basis);
  if (numbers.date !== undefined) r.date = numbers.date;
  if (numbers.over_range) r.over_range = true;
  return r;
}

export const notVerified = (id: CheckId, why: Words): CheckResult => result(id, 'not-verified', why);
export const notApplicable = (id: CheckId, why: string): CheckResult => result(id, 'n/a', why);

/** A reading that cannot be judged: missing, not tested, or n/a where a value is needed. */
export function unusable(id: CheckId, name: string, m: SessionValue<Reading> | undefined): CheckResult | null {
  if (!m) return notVerified(id, `no ${name} recorded in any test session`);
  if (m.value.kind === 'not-tested') return result(id, 'not-verified', `${name} marked not tested on ${m.date}`, { date: m.date });
  if (m.value.kind === 'n/a') return result(id, 'not-verified', `${name} marked n/a on ${m.date}; this circuit needs it`, { date: m.date });
  return null;
}

export type Numeric = Extract<Reading, { value: number }>;

/** The number of a reading `unusable` has passed: a value, or an over-range lower bound. */
export function numberOf(m: SessionValue<Reading>): Numeric {
  if (m.value.kind !== 'value' && m.value.kind !== 'at-least') throw new Error(`reading of ${m.date} has no number`);
  return m.value;
}

/** How a number reads in a basis line: an over-range reading keeps its ">". */
export const shown = (r: Numeric, unit: string): string => `${r.kind === 'at-least' ? '>' : ''}${fmt(r.value)} ${unit}`;

/**
 * Why `m` (an n/a) applies, from the notes of the same session: a reason written for another
 * session's readings is not this one's. Undefined where that session gave no note.
 */
export const reasonFor = (notes: Measured<string> | undefined, m: SessionValue<unknown>): string | undefined =>
  inSession(notes, m.file)?.value;

/**
 * Where a value and its limit read alike at three figures ("1.04 Ω > 1.04 Ω"), the two to five
 * figures, so the line shows which side of the limit the value lies; else nothing.
 */
export const toFiveFigures = (value: number, op: string, limit: number, unit: string): string =>
  fmt(value) === fmt(limit) ? ` (to five figures ${fmt(value, 5)} ${unit} ${op} ${fmt(limit, 5)} ${unit})` : '';

const SEVERITY: readonly Status[] = ['fail', 'not-verified', 'attention', 'pass', 'n/a'];

/** The most severe of several statuses: fail, then not verified, then attention, then pass. */
export function worst(statuses: readonly Status[]): Status {
  return SEVERITY.find((s) => statuses.includes(s)) ?? 'n/a';
}

/** The latest of some test dates (ISO dates sort as text). */
export function latest(dates: readonly string[]): string | undefined {
  return [...dates].sort().at(-1);
}
