// RCD: trip times at 1 × and 5 × IΔn against the limits for the device's type (general, or
// time-delayed "-S"), IEC 61008-1 / IEC 61009-1, and the test-button result. Both trip times and
// the button are needed; a missing one leaves the check not verified. A type S device that opens
// faster than its non-actuating time keeps the circuit safe but loses selectivity: attention.
import { rcdKind } from '../devices/rcd.js';
import type { Check, CheckResult, CircuitContext, Status } from '../types.js';
import { fmt, type Reading } from '../../model/units.js';
import { unmeasured, type SessionValue } from '../../model/readings.js';
import { RCD_BREAK_TIMES, type RcdKind } from '../../reference/rcd.js';
import { latest, notApplicable, numberOf, reasonFor, result, shown, unusable, worst } from './result.js';

const id = 'rcd';

interface Part {
  status: Status;
  words: string;
  value: number | null;
  over_range: boolean;
  limit: number | null;
  date: string;
}

function tripTime(ctx: CircuitContext, kind: RcdKind, multiple: 1 | 5, standard: string): Part | CheckResult {
  const field = multiple === 1 ? 'rcd_1x_ms' : 'rcd_5x_ms';
  const m = ctx.readings[field];
  const missing = unusable(id, `RCD trip time at ${multiple} × IΔn`, m);
  if (missing) return missing;
  const t = numberOf(m!);
  const limits = RCD_BREAK_TIMES[kind].find((l) => l.multiple === multiple)!;
  const at = `${multiple} × IΔn ${shown(t, 'ms')}`;
  const part = (status: Status, words: string, limit: number): Part => ({ status, words, value: t.value, over_range: t.kind === 'at-least', limit, date: m!.date });
  // ">N" is above N: at or beyond the limit it is a fail
  if (t.value > limits.max_ms || (t.kind === 'at-least' && t.value >= limits.max_ms)) return part('fail', `${at} > ${limits.max_ms} ms`, limits.max_ms);
  if (t.kind === 'at-least') return part('not-verified', `${at} (over range) cannot show ≤ ${limits.max_ms} ms`, limits.max_ms);
  if (limits.min_ms !== null && t.value < limits.min_ms) {
    return part('attention', `${at} < ${limits.min_ms} ms, faster than a time-delayed device may open (${standard}): selectivity is lost`, limits.min_ms);
  }
  const range = limits.min_ms === null ? `≤ ${limits.max_ms} ms` : `within ${limits.min_ms}–${limits.max_ms} ms`;
  return part('pass', `${at} ${range}`, limits.max_ms);
}

function testButton(ctx: CircuitContext): Part | CheckResult {
  const m = ctx.readings.rcd_button;
  if (!m) return result(id, 'not-verified', 'no RCD test-button result recorded in any test session');
  const part = (status: Status, words: string): Part => ({ status, words, value: null, over_range: false, limit: null, date: m.date });
  switch (m.value) {
    case 'ok': return part('pass', 'test button ok');
    case 'fail': return part('fail', 'test button did not trip the RCD');
    case 'n/a': {
      const reason = reasonFor(ctx.readings.notes, m);
      return reason !== undefined ? part('n/a', `test button n/a: ${reason}`) : result(id, 'not-verified', `RCD test button marked n/a on ${m.date} with no reason in that session's notes`, { date: m.date });
    }
    default: return result(id, 'not-verified', `RCD test button marked not tested on ${m.date}`, { date: m.date });
  }
}

/**
 * RCD results recorded for a circuit that circuits.csv gives no RCD: they cannot be judged without
 * the RCD's rating, and a failing one must not vanish behind "no RCD". `attention`, naming them.
 */
function strayResults({ readings }: CircuitContext): CheckResult | null {
  const found = ([['rcd_1x_ms', '1 × IΔn'], ['rcd_5x_ms', '5 × IΔn'], ['rcd_button', 'test button']] as const).flatMap(([field, name]) => {
    const m = readings[field];
    if (!m || unmeasured(m.value)) return [];
    const value = typeof m.value === 'string' ? m.value : shown(numberOf(m as SessionValue<Reading>), 'ms');
    return [{ words: `${name} ${value} on ${m.date}`, date: m.date }];
  });
  if (found.length === 0) return null;
  return result(id, 'attention', `circuits.csv gives no RCD on this circuit, but RCD results were recorded (${found.map((f) => f.words).join('; ')}): give the RCD's rcd_ma and rcd_type so they are judged, or correct the readings`, { date: latest(found.map((f) => f.date)) });
}

const isPart = (p: Part | CheckResult): p is Part => !('id' in p);

export const rcd: Check = (ctx) => {
  const { circuit } = ctx;
  if (circuit.rcd_ma === undefined) return strayResults(ctx) ?? notApplicable(id, 'no RCD on this circuit');
  const kind: RcdKind = rcdKind(circuit.rcd_type);
  const standard = circuit.device.startsWith('rcbo:') ? 'IEC 61009-1' : 'IEC 61008-1';
  const parts = [tripTime(ctx, kind, 1, standard), tripTime(ctx, kind, 5, standard), testButton(ctx)];
  const open = parts.find((p) => !isPart(p));
  if (open) return open as CheckResult;
  const judged = parts as Part[];
  const status = worst(judged.map((p) => p.status));
  // the number shown is the trip time the verdict turned on (the 1 × time when all pass)
  const decisive = judged.find((p) => p.status === status && p.value !== null) ?? judged[0]!;
  const device = `${fmt(circuit.rcd_ma)} mA ${circuit.rcd_type === undefined ? 'RCD of unrecorded type, general-type limits applied' : `type ${circuit.rcd_type} RCD`}`;
  const basis = `${device}: ${judged.map((p) => p.words).join('; ')} (${standard}, ${kind === 'S' ? 'time-delayed' : 'general'} type)`;
  return result(id, status, basis, { value: decisive.value, over_range: decisive.over_range, limit: decisive.limit, unit: 'ms', date: latest(judged.map((p) => p.date)) });
};
