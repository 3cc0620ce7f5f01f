// Re-tests: a later session supersedes an earlier one field by field, and each check keeps the
// verdict of every earlier value it judged.
import { describe, expect, it } from 'vitest';
import { traced } from '../../src/calc/history.js';
import { zsMeasured } from '../../src/calc/checks/zs-measured.js';
import { insulation } from '../../src/calc/checks/insulation.js';
import { rcdTt } from '../../src/calc/checks/rcd-tt.js';
import { polarity } from '../../src/calc/checks/polarity.js';
import { sessions } from '../helpers/context.js';

// B32 at 0.4 s: max Zs 230 × 0.95 / 160 = 1.366 Ω (IEC 60898-1 band); 0.8 × = 1.093 Ω (common practice)
describe('a re-test traced through its sessions', () => {
  it('turns a fail into a pass and keeps the failed value with its verdict', () => {
    const r = traced(zsMeasured, sessions({}, [
      { date: '2026-11-13', readings: { zs_ohm: '1.62' } },
      { date: '2026-11-20', readings: { zs_ohm: '0.71' } },
    ]));
    expect(r).toMatchObject({ status: 'pass', value: 0.71, date: '2026-11-20' });
    expect(r.history).toEqual([
      { date: '2026-11-13', value: 1.62, status: 'fail' },
      { date: '2026-11-20', value: 0.71, status: 'pass' },
    ]);
  });
  it('turns a pass into a fail and keeps the passed value with its verdict', () => {
    const r = traced(insulation, sessions({}, [
      { date: '2026-11-13', readings: { ir_le_mohm: '>999', ir_ll_mohm: '>999', ir_test_v: '500' } },
      { date: '2026-12-01', readings: { ir_le_mohm: '0.4' } },
    ]));
    expect(r.status).toBe('fail'); // 0.4 MΩ < 1.0 MΩ, IEC 60364-6 Table 6A
    expect(r.history).toEqual([
      { date: '2026-11-13', value: 999, over_range: true, status: 'pass' },
      { date: '2026-12-01', value: 0.4, status: 'fail' },
    ]);
  });
  it('keeps the fields a later session does not repeat (field by field)', () => {
    const r = traced(insulation, sessions({}, [
      { date: '2026-11-13', readings: { ir_le_mohm: '0.8', ir_ll_mohm: '>999', ir_test_v: '500' } },
      { date: '2026-11-20', readings: { ir_le_mohm: '300' } },
    ]));
    expect(r.status).toBe('pass'); // L–L and the test voltage carried over from 2026-11-13
    expect(r.history?.map((h) => h.status)).toEqual(['fail', 'pass']);
  });
  it('starts the history at the first session that gave the check something to judge', () => {
    const r = traced(zsMeasured, sessions({}, [
      { date: '2026-11-13', readings: { polarity: 'ok' } },
      { date: '2026-11-20', readings: { zs_ohm: 'not-tested' } },
      { date: '2026-11-27', readings: { zs_ohm: '0.9' } },
    ]));
    expect(r.history).toEqual([
      { date: '2026-11-20', value: null, status: 'not-verified' },
      { date: '2026-11-27', value: 0.9, status: 'pass' },
    ]);
  });
  it('gives no history to a check judged once, or not from readings', () => {
    const two = sessions({ rcd_ma: '30' }, [
      { date: '2026-11-13', readings: { polarity: 'ok' } },
      { date: '2026-11-20', readings: { zs_ohm: '0.5' } },
    ], { earthing: 'TT', ra_ohm: '40' });
    expect(traced(polarity, two).history).toBeUndefined();
    expect(traced(zsMeasured, two).history).toBeUndefined();
    expect(traced(rcdTt, two).history).toBeUndefined();
  });
});
