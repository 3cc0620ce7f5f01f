// Re-tests: a later session supersedes an earlier one field by field, and each check keeps the
// verdict of every earlier value it judged.
import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { readJob } from '../../src/load/job.js';
import { validate } from '../../src/model/validate.js';
import { assess } from '../../src/calc/assess.js';
import { rowsByCircuit, traced } from '../../src/calc/history.js';
import { circuitKey } from '../../src/model/readings.js';
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
      { date: '2026-11-20', readings: { ir_le_mohm: '300', ir_test_v: '500' } },
    ]));
    expect(r.status).toBe('pass'); // L–L carried over from 2026-11-13, with that session's 500 V
    expect(r.history?.map((h) => h.status)).toEqual(['fail', 'pass']);
  });
  it('judges a reading at the test voltage of its own session, not one an earlier session gave', () => {
    // the re-test gives no voltage: it may have been the 250 V test, which could at best be
    // attention (BS 7671 643.3; IEC 60364-6, 6.4.3.3), so 300 MΩ cannot pass on 2026-11-13's 500 V
    const r = traced(insulation, sessions({}, [
      { date: '2026-11-13', readings: { ir_le_mohm: '0.8', ir_ll_mohm: '>999', ir_test_v: '500' } },
      { date: '2026-11-20', readings: { ir_le_mohm: '300' } },
    ]));
    expect(r.status).toBe('not-verified');
    expect(r.basis).toBe('no insulation test voltage (ir_test_v) recorded with the L–E reading of 2026-11-20');
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
  it('judges a circuit tested in one session as the check alone does, with no history', () => {
    // B32 at 0.4 s: 1.62 Ω > max Zs 1.366 Ω (IEC 60898-1 band): a fail, judged once
    const one = sessions({}, [{ date: '2026-11-13', readings: { zs_ohm: '1.62' } }]);
    expect(one).toHaveLength(1);
    const r = traced(zsMeasured, one);
    expect(r).toEqual(zsMeasured(one[0]!.ctx));
    expect(r.status).toBe('fail');
    expect(r.date).toBe('2026-11-13');
    expect(r.history).toBeUndefined();
  });
});

describe('re-tests in a job folder (tests/fixtures/tt-instrument-job)', () => {
  const v = validate(readJob(fileURLToPath(new URL('../fixtures/tt-instrument-job/', import.meta.url))));
  if (!v.ok) throw new Error('fixture invalid');
  const a = assess(v.project);
  const check = (ref: string, id: string) => a.circuits.find((c) => c.ref === ref)!.checks.find((k) => k.id === id)!;

  it('traces a ring whose neutral was remade: fail, then pass', () => {
    const ring = check('2', 'ring');
    expect(ring.status).toBe('pass'); // r1 0.52, rn 0.53: within 0.05 Ω (common practice)
    expect(ring.history?.map((h) => [h.date, h.status])).toEqual([['2026-11-13', 'fail'], ['2026-11-20', 'pass']]);
  });
  it('traces insulation that passed and failed at the instrument export: pass, then fail', () => {
    const ir = check('1', 'insulation');
    expect(ir.status).toBe('fail'); // 0.6 MΩ < 1.0 MΩ at 500 V (IEC 60364-6 Table 6A)
    expect(ir.history).toEqual([
      { date: '2026-11-13', value: 999, over_range: true, status: 'pass' },
      { date: '2026-11-27', value: 0.6, status: 'fail' },
    ]);
  });
  it("works each circuit's history from its own rows, grouped once and kept in session order", () => {
    const rows = v.project.rows;
    const by = rowsByCircuit(rows);
    // the fixture interleaves circuits within a session and sessions within a circuit
    expect(new Set(rows.map((r) => r.date)).size).toBeGreaterThan(1);
    expect([...by.values()].some((own) => own.length > 1)).toBe(true);
    for (const c of v.project.circuits) {
      const key = circuitKey(c.board, c.ref);
      expect(by.get(key) ?? []).toEqual(rows.filter((r) => circuitKey(r.values.board, r.values.ref) === key));
    }
    expect([...by.values()].reduce((n, own) => n + own.length, 0)).toBe(rows.length);
  });
  it('counts every check in the summary, and never passes what is not verified', () => {
    const total = a.circuits.reduce((n, c) => n + c.checks.length, 0);
    expect(Object.values(a.summary).reduce((x, y) => x + y, 0)).toBe(total);
    expect(a.summary.fail).toBe(1);
    // continuity against the expected R1+R2 of the design table: each within 25 % + 0.05 Ω (common practice)
    expect(a.circuits.map((c) => c.checks.find((k) => k.id === 'continuity')!.status)).toEqual(['pass', 'pass', 'pass']);
    // breaking capacity cannot be shown: no prospective fault current recorded
    expect(a.summary['not-verified']).toBe(3);
  });
});
