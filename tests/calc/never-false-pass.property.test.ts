// Property: removing any one reading from a circuit never turns a check, or the circuit's
// verdict over its measured-result checks, into a pass. A missing reading is never a pass.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CHECKS } from '../../src/calc/checks/index.js';
import type { CheckId, CircuitContext, Status } from '../../src/calc/types.js';
import { worst } from '../../src/calc/checks/result.js';
import { context } from '../helpers/context.js';

const MEASURED_CHECKS: CheckId[] = ['continuity', 'ring', 'insulation', 'polarity', 'zs-measured', 'rcd', 'rcd-tt'];
const checks = CHECKS.filter(([id]) => MEASURED_CHECKS.includes(id));

const statuses = (ctx: CircuitContext) => Object.fromEntries(checks.map(([id, check]) => [id, check(ctx).status])) as Record<string, Status>;
/** the circuit's verdict: the worst of its checks, those that do not apply left out */
const verdict = (s: Record<string, Status>): Status => worst(Object.values(s).filter((x) => x !== 'n/a'));

const decimal = (min: number, max: number, places = 2) =>
  fc.integer({ min: Math.round(min * 10 ** places), max: Math.round(max * 10 ** places) }).map((n) => String(n / 10 ** places));
const open = [{ arbitrary: fc.constant('n/a'), weight: 1 }, { arbitrary: fc.constant('not-tested'), weight: 1 }];
const ohm = fc.oneof({ arbitrary: decimal(0.01, 2), weight: 12 }, { arbitrary: decimal(2, 200, 1), weight: 2 },
  { arbitrary: decimal(0.5, 20).map((v) => `>${v}`), weight: 1 }, ...open);
const megohm = fc.oneof({ arbitrary: fc.constant('>999'), weight: 8 }, { arbitrary: decimal(0.2, 500, 1), weight: 4 },
  { arbitrary: decimal(0.2, 5, 1).map((v) => `>${v}`), weight: 1 }, ...open);
const ms = fc.oneof({ arbitrary: fc.integer({ min: 5, max: 600 }).map(String), weight: 10 }, { arbitrary: fc.constantFrom('>300', '>40'), weight: 1 }, ...open);
const outcome = fc.oneof({ arbitrary: fc.constant('ok'), weight: 10 }, { arbitrary: fc.constantFrom('fail', 'n/a', 'not-tested'), weight: 1 });

const circuit = fc.tuple(
  fc.constantFrom('mcb:B', 'mcb:C', 'mcb:D', 'rcbo:B', 'rcbo:C'),
  fc.constantFrom('6', '10', '16', '20', '32'),
  fc.constantFrom(['1.5', '1.0'], ['2.5', '1.5'], ['4', '1.5'], ['6', '6']),
  fc.constantFrom('yes', 'no'),
  fc.option(fc.constantFrom('30', '100', '300'), { nil: undefined }),
  fc.option(fc.constantFrom('AC', 'A', 'A-S', 'F'), { nil: undefined }),
  fc.constantFrom('1', '3'),
).map(([device, rating_a, [live_mm2, cpc_mm2], ring, rcd_ma, rcd_type, phases]) => ({
  device, rating_a, live_mm2: live_mm2!, cpc_mm2: cpc_mm2!, ring, phases,
  ...(rcd_ma ? { rcd_ma } : {}), ...(rcd_type ? { rcd_type } : {}),
}));

const supply = fc.record({
  earthing: fc.constantFrom('TN-S', 'TN-C-S', 'TT'),
  ze_ohm: decimal(0.05, 0.5),
  ra_ohm: decimal(5, 400, 0),
}, { requiredKeys: ['earthing'] });

const extra = fc.record({
  expected: fc.option(decimal(0.05, 1.5), { nil: undefined }),
  zdb: fc.option(decimal(0.1, 1.2), { nil: undefined }),
}).map(({ expected, zdb }) => ({
  derived: { r1r2_expected_ohm: expected === undefined ? null : Number(expected) },
  board: zdb === undefined ? {} : { zdb_ohm: zdb },
}));

/** Readings of a circuit: mostly coherent (a sound ring, R1+R2 near the expected value, Zs near
 * Ze + R1+R2), each field sometimes replaced by a random cell or left out. */
function readingsFor(c: { live_mm2: string; cpc_mm2: string }, expected: number | null, ze: number) {
  const ratio = Number(c.live_mm2) / Number(c.cpc_mm2);
  const sometimes = (good: fc.Arbitrary<string>, other: fc.Arbitrary<string>) =>
    fc.option(fc.oneof({ arbitrary: good, weight: 6 }, { arbitrary: other, weight: 1 }), { freq: 8, nil: undefined });
  const near = (v: number, spread: number) => decimal(-spread, spread, 3).map((d) => String(Math.max(0.01, Number((v + Number(d)).toFixed(3)))));
  return fc.tuple(decimal(0.1, 1.0), decimal(0.7, 1.4)).chain(([r1s, k]) => {
    const r1 = Number(r1s);
    const r2 = r1 * ratio;
    const r1r2 = expected === null ? (r1 + r2) / 4 : expected * Number(k);
    return fc.record({
      ring_r1_ohm: sometimes(fc.constant(r1s), ohm),
      ring_rn_ohm: sometimes(near(r1, 0.06), ohm),
      ring_r2_ohm: sometimes(near(r2, 0.06), ohm),
      r1r2_ohm: sometimes(near(r1r2, 0.06), ohm),
      ir_ll_mohm: sometimes(fc.constant('>999'), megohm),
      ir_le_mohm: sometimes(fc.constant('>999'), megohm),
      ir_test_v: sometimes(fc.constant('500'), fc.constantFrom('250', '1000', '>500', 'n/a', 'not-tested')),
      zs_ohm: sometimes(near(ze + r1r2, 0.1), ohm),
      rcd_1x_ms: sometimes(fc.integer({ min: 10, max: 320 }).map(String), ms),
      rcd_5x_ms: sometimes(fc.integer({ min: 5, max: 45 }).map(String), ms),
      polarity: sometimes(fc.constant('ok'), outcome),
      rcd_button: sometimes(fc.constant('ok'), outcome),
      tested_by: fc.option(fc.constant('A. Tester'), { nil: undefined }),
      notes: fc.option(fc.constant('a remark'), { nil: undefined }),
    }).map((r) => Object.fromEntries(Object.entries(r).filter(([, v]) => v !== undefined)) as Record<string, string>);
  });
}

const scenario = fc.tuple(circuit, supply, extra).chain(([c, s, x]) =>
  readingsFor(c, x.derived.r1r2_expected_ohm, Number(s.ze_ohm ?? 0.2)).map((r) => ({ c, s, x, r })));

describe('a missing reading is never a pass (fast-check)', () => {
  it('removing any one reading never turns a check or the circuit verdict into pass', () => {
    let passes = 0;
    let checkPasses = 0;
    let judged = 0;
    fc.assert(fc.property(scenario, ({ c, s, x, r }) => {
      const before = statuses(context(c, r, s, 0.4, x));
      for (const field of Object.keys(r)) {
        const rest: Record<string, string> = { ...r };
        delete rest[field];
        const after = statuses(context(c, rest, s, 0.4, x));
        for (const id of MEASURED_CHECKS) {
          if (before[id] !== 'pass' && before[id] !== 'n/a') judged += 1;
          if (after[id] === 'pass') {
            checkPasses += 1;
            expect(before[id], `${id} after removing ${field}`).toBe('pass');
          }
        }
        if (verdict(after) === 'pass') {
          passes += 1;
          expect(verdict(before)).toBe('pass');
        }
      }
    }), { numRuns: 400 });
    // the generators must reach passing checks and circuits, and checks that do not pass, or the
    // property says nothing
    expect(passes).toBeGreaterThan(5);
    expect(checkPasses).toBeGreaterThan(2000);
    expect(judged).toBeGreaterThan(2000);
  });

  it('gives every n/a its reason', () => {
    fc.assert(fc.property(scenario, ({ c, s, x, r }) => {
      for (const [, check] of checks) {
        const k = check(context(c, r, s, 0.4, x));
        if (k.status === 'n/a') expect(k.basis.length).toBeGreaterThan(10);
      }
    }), { numRuns: 100 });
  });

  it('a circuit with no readings at all passes no measured check that applies to it', () => {
    fc.assert(fc.property(circuit, supply, extra, (c, s, x) => {
      const st = statuses(context(c, {}, s, 0.4, x));
      for (const id of MEASURED_CHECKS) if (id !== 'rcd-tt') expect(st[id]).not.toBe('pass');
    }), { numRuns: 200 });
  });
});
