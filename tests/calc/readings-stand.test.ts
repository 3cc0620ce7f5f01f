// Readings that must not be set aside: a measurement stands until it is measured again (a later
// "n/a" does not clear it), an n/a needs its reason from its own session, an insulation reading is
// judged at its own session's test voltage, RCD results on a circuit with no RCD are shown, and the
// inputs that would hide a reading (an RCD rating in amperes, an RCD type without its rating, one
// session given twice) are input errors. Each case was a false pass or a hidden failure before.
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { CircuitSchema } from '../../src/model/schema.js';
import { mergeSessions, unmeasured, type SessionRow } from '../../src/model/readings.js';
import { ReadingRowSchema } from '../../src/model/schema.js';
import { rcdRating } from '../../src/calc/inputs.js';
import { traced } from '../../src/calc/history.js';
import { insulation } from '../../src/calc/checks/insulation.js';
import { polarity } from '../../src/calc/checks/polarity.js';
import { rcd } from '../../src/calc/checks/rcd.js';
import { assess } from '../../src/calc/assess.js';
import { isCalendarDate } from '../../src/load/date.js';
import { context, sessions } from '../helpers/context.js';
import { BASE_CIRCUIT, project } from '../helpers/project.js';
import { demoCopy, errorsOf, replaceIn, write } from '../helpers/job.js';
import { readFileSync } from 'node:fs';

const rcbo = { device: 'rcbo:B', rcd_ma: '30', rcd_type: 'A' };

describe('a measurement stands until it is measured again', () => {
  it('is not replaced by a later n/a or not-tested, and is by a later measurement', () => {
    const row = (date: string, readings: Record<string, string>, n: number): SessionRow => ({
      date, file: `readings/${date}.csv`, row: n, values: ReadingRowSchema.parse({ board: 'DB1', ref: '1', ...readings }),
    });
    const merged = mergeSessions([
      row('2026-11-13', { ir_ll_mohm: '0.4', polarity: 'fail', zs_ohm: 'n/a' }, 2),
      row('2026-11-20', { ir_ll_mohm: 'n/a', polarity: 'not-tested', zs_ohm: '0.7' }, 2),
    ]).get('DB1/1')!;
    expect(merged.ir_ll_mohm).toMatchObject({ value: { kind: 'value', value: 0.4 }, date: '2026-11-13' });
    expect(merged.polarity).toMatchObject({ value: 'fail', date: '2026-11-13' });
    expect(merged.zs_ohm).toMatchObject({ value: { kind: 'value', value: 0.7 }, date: '2026-11-20' });
    expect([{ kind: 'n/a' }, { kind: 'not-tested' }, 'n/a', 'not-tested'].every(unmeasured)).toBe(true);
    expect([{ kind: 'value', value: 0 }, 'ok', 'fail', 'a note'].some(unmeasured)).toBe(false);
  });

  it('keeps a failing insulation reading failing when a re-test marks it n/a with a reason', () => {
    // 0.4 MΩ < 1 MΩ at 500 V for a circuit up to 500 V (IEC 60364-6 Table 6.1)
    const r = traced(insulation, sessions({}, [
      { date: '2026-11-13', readings: { ir_ll_mohm: '0.4', ir_le_mohm: '>999', ir_test_v: '500' } },
      { date: '2026-11-20', readings: { ir_ll_mohm: 'n/a', notes: 'SPD and RCBO left connected' } },
    ]));
    expect(r.status).toBe('fail');
    expect(r).toMatchObject({ value: 0.4, date: '2026-11-13' });
  });

  it('keeps a failed polarity and a failed test button failing after a later n/a', () => {
    // polarity: single-pole devices in the line conductor (IEC 60364-6, 6.4.3.6); the test button
    // must trip the RCD (IEC 61008-1 / 61009-1)
    const later = { polarity: 'n/a', rcd_button: 'n/a', notes: 'left for the client' };
    expect(traced(polarity, sessions({}, [{ date: '2026-11-13', readings: { polarity: 'fail' } }, { date: '2026-11-20', readings: later }])).status).toBe('fail');
    const r = traced(rcd, sessions(rcbo, [
      { date: '2026-11-13', readings: { rcd_1x_ms: '19', rcd_5x_ms: '8', rcd_button: 'fail' } },
      { date: '2026-11-20', readings: later },
    ]));
    expect(r.status).toBe('fail');
    expect(r.basis).toContain('test button did not trip the RCD');
  });
});

describe('an n/a takes its reason from its own session', () => {
  it('is not verified where only another session has a note', () => {
    const r = traced(insulation, sessions({}, [
      { date: '2026-11-13', readings: { ir_le_mohm: '>999', ir_test_v: '500', notes: 'socket added behind the counter' } },
      { date: '2026-11-20', readings: { ir_ll_mohm: 'n/a' } },
    ]));
    expect(r.status).toBe('not-verified');
    expect(r.basis).toBe("insulation resistance L–L marked n/a on 2026-11-20 with no reason in that session's notes");
  });

  it('takes the reason written beside it', () => {
    // L–E >999 MΩ at 500 V ≥ 1 MΩ (IEC 60364-6 Table 6.1)
    const r = insulation(context({}, { ir_le_mohm: '>999', ir_ll_mohm: 'n/a', ir_test_v: '500', notes: 'SPD left connected' }));
    expect(r.status).toBe('pass');
    expect(r.basis).toContain('L–E (L–L n/a)');
    const p = polarity(context({}, { polarity: 'n/a', notes: 'fixed wiring only' }));
    expect(p).toMatchObject({ status: 'n/a', basis: 'polarity marked n/a on 2026-11-13: fixed wiring only' });
  });
});

describe('an insulation reading is judged at its own session\'s test voltage', () => {
  it('fails a reading below the minimum whatever voltage it was made at, even with none recorded', () => {
    // 0.4 MΩ is below 1 MΩ, the minimum at 500 V and at the 250 V test alike (IEC 60364-6 Table 6.1;
    // BS 7671 643.3)
    const r = traced(insulation, sessions({}, [
      { date: '2026-11-13', readings: { ir_le_mohm: '>999', ir_ll_mohm: '>999', ir_test_v: '500' } },
      { date: '2026-11-20', readings: { ir_le_mohm: '0.4' } },
    ]));
    expect(r.status).toBe('fail');
    expect(r.basis).toContain('no test voltage (ir_test_v) recorded with it on 2026-11-20');
  });

  it('takes a tester\'s output above its nominal 250 V as the 250 V test: attention, never a fail for the wrong voltage', () => {
    // an insulation tester's output is at or above its nominal voltage (IEC 61557-2; up to 1.5 ×,
    // from memory): 260 V is the 250 V test, allowed at 1 MΩ where equipment cannot be disconnected
    // (BS 7671 643.3; IEC 60364-6, 6.4.3.3)
    const r = insulation(context({}, { ir_le_mohm: '50', ir_ll_mohm: '50', ir_test_v: '260' }));
    expect(r.status).toBe('attention');
    expect(r.basis).toContain('tested at 260 V d.c. (a 250 V test) instead of 500 V');
    const low = insulation(context({}, { ir_le_mohm: '0.9', ir_ll_mohm: '50', ir_test_v: '250' }));
    expect(low.status).toBe('fail');
    expect(low.basis).toMatch(/^0\.9 MΩ < 1 MΩ; tested at 250 V d\.c\. instead of 500 V/);
  });

  it('judges each reading at the lower of the voltages its sessions recorded', () => {
    // L–L kept from a 250 V session, L–E re-tested at 500 V: the weaker, 250 V test decides (BS 7671 643.3)
    const r = traced(insulation, sessions({}, [
      { date: '2026-11-13', readings: { ir_le_mohm: '0.8', ir_ll_mohm: '200', ir_test_v: '250' } },
      { date: '2026-11-20', readings: { ir_le_mohm: '300', ir_test_v: '500' } },
    ]));
    expect(r.status).toBe('attention');
  });
});

describe('RCDs the readings would otherwise hide', () => {
  it('refuses a residual current rating that can only be amperes written as milliamperes', () => {
    // IEC 61008-1 / 61009-1 preferred IΔn start at 6 mA (from memory): 0.3 is 300 mA written in amperes;
    // judged as 0.3 mA it gave RA × IΔn = 0.054 V ≤ 50 V (IEC 60364-4-41, 411.5.3) and passed
    const bad = CircuitSchema.safeParse({ ...BASE_CIRCUIT, ref: '1', rcd_ma: '0.3' });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.message).toMatch(/not a plausible rcd_ma \(from 6 to 30000 mA\)/);
    expect(CircuitSchema.parse({ ...BASE_CIRCUIT, ref: '1', rcd_ma: '0.3 A' }).rcd_ma).toBe(300);
    expect(CircuitSchema.parse({ ...BASE_CIRCUIT, ref: '1', rcd_ma: '10' }).rcd_ma).toBe(10);
  });

  it('needs the rating of an RCD whose type is given, so that its results are judged', () => {
    const c = (over: Record<string, string>) => CircuitSchema.parse({ ...BASE_CIRCUIT, ref: '1', ...over });
    expect(rcdRating(c({ rcd_type: 'A' }), null)).toMatchObject({ field: 'rcd_ma', message: expect.stringMatching(/type A RCD/) });
    expect(rcdRating(c({ rcd_type: 'A', rcd_ma: '30' }), null)).toBeNull();
    expect(rcdRating(c({}), null)).toBeNull();
  });
});

describe('the loop through a board is never less than Ze', () => {
  it('fails R1+R2 on a board whose recorded Zdb is below Ze', () => {
    // Ze is part of every loop: Ze 0.8 + R1+R2 0.5 × 1.1965 (PVC at 70 °C, α 0.00393, IEC 60287-1-1) =
    // 1.398 Ω > max Zs 230 × 0.95 / (5 × 32 A) = 1.366 Ω (IEC 60898-1 type B; IEC 60364-4-41, 411.4.4)
    const p = project([{ live_mm2: '4', length_m: '23' }], { supply: { earthing: 'TN-S', ze_ohm: 0.8, pfc_ka: 1 }, boards: [{ id: 'DB1', zdb_ohm: 0.2 }] }, { 1: { r1r2_ohm: '0.5' } });
    const c = assess(p).circuits[0]!.checks.find((k) => k.id === 'continuity')!;
    expect(c.status).toBe('fail');
    expect(c.basis).toContain('Ze 0.8 Ω (above the 0.2 Ω measured at DB1: the larger is taken)');
    const z = assess(project([{ live_mm2: '4', length_m: '23' }], { supply: { earthing: 'TN-S', ze_ohm: 0.8, pfc_ka: 1 }, boards: [{ id: 'DB1', zdb_ohm: 0.2 }] }, { 1: { zs_ohm: '0.5' } }))
      .circuits[0]!.checks.find((k) => k.id === 'zs-measured')!;
    expect(z.status).toBe('attention');
    expect(z.basis).toContain('below Ze 0.8 Ω');
  });
});

describe('design Zs against the limit as worked out, not as rounded', () => {
  it('fails a design Zs between max Zs and its rounding to three places', () => {
    // max Zs = 230 × 0.95 / (5 × 32 A) = 1.365625 Ω (IEC 60898-1 type B instantaneous trip;
    // Cmin 0.95), shown as 1.366; the run is chosen so design Zs = Ze + (r1 + r2) × L × 1.1965 lies
    // between the two (IEC 60228: 7.41 and 12.1 mΩ/m at 20 °C; α 0.00393, PVC at 70 °C)
    const perM = (7.41 + 12.1) / 1000 * (1 + 0.00393 * 50);
    const length = Math.round(((1.3658 - 0.8) / perM) * 1000) / 1000;
    const zs = 0.8 + perM * length;
    expect(zs).toBeGreaterThan(1.365625);
    expect(zs).toBeLessThan(1.366);
    const ctx = context({ length_m: String(length) }, {}, { earthing: 'TN-S', ze_ohm: 0.8, pfc_ka: 1 });
    const [, zsDesign] = [ctx.derived.max_zs_ohm, (ctx as unknown as { maxZsOhm: number }).maxZsOhm];
    expect(ctx.derived.max_zs_ohm).toBe(1.366);
    expect(zsDesign).toBeCloseTo(1.365625, 9);
    const r = assess(project([{ length_m: String(length) }], { supply: { earthing: 'TN-S', ze_ohm: 0.8, pfc_ka: 1 } })).circuits[0]!.checks.find((k) => k.id === 'zs-design')!;
    expect(r.status).toBe('fail');
    expect(r.basis).toContain('(to five figures 1.3658 Ω > 1.3656 Ω)');
  });
});

describe('the session files of a job', () => {
  it('refuse one session given twice, told apart only by capital letters', () => {
    const job = demoCopy();
    const dir = join(job, 'readings');
    write(job, 'readings/2026-11-13.CSV', readFileSync(join(dir, '2026-11-13.csv')));
    expect(errorsOf(job).join('\n')).toMatch(/readings\/2026-11-13\.csv:1:1: the same session as readings\/2026-11-13\.CSV/i);
  });

  it('refuse a date that is not a day of the calendar', () => {
    const job = demoCopy();
    write(job, 'readings/2026-02-31.csv', 'board,ref,zs_ohm\nDB1,1,0.5\n');
    expect(errorsOf(job)).toContain('readings/2026-02-31.csv:1:1: 2026-02-31 is not a day of the calendar; a readings file is named after its test date: YYYY-MM-DD.csv or YYYY-MM-DD-label.csv');
    replaceIn(job, 'project.yaml', 'started: 2026-11-02', 'started: 2026-02-30');
    expect(errorsOf(job).join('\n')).toMatch(/expected a date as YYYY-MM-DD that is a day of the calendar/);
    // the Gregorian calendar: 2024 is a leap year, 2100 is not
    expect(['2024-02-29', '2026-12-31', '2026-01-01'].every(isCalendarDate)).toBe(true);
    expect(['2026-02-29', '2100-02-29', '2026-04-31', '2026-13-01', '2026-00-10', '0099-01-01', '2026-1-01'].some(isCalendarDate)).toBe(false);
  });
});

describe('a result cell', () => {
  it('reads n/a and not tested in the words a number cell reads them', () => {
    for (const [written, read] of [['NA', 'n/a'], ['n/a', 'n/a'], ['not tested', 'not-tested'], ['NT', 'not-tested'], ['OK', 'ok']] as const) {
      expect(ReadingRowSchema.parse({ board: 'DB1', ref: '1', polarity: written, rcd_button: written })).toMatchObject({ polarity: read, rcd_button: read });
    }
    expect(ReadingRowSchema.safeParse({ board: 'DB1', ref: '1', polarity: 'passed' }).success).toBe(false);
  });
});
