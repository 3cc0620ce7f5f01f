// Properties: removing any one reading, design value or recorded attribute of a circuit (so that the
// rule set's default is chosen for it), or relaxing a rule, never turns a check or the circuit's
// verdict into a pass; and every pass names the rule that earned it. A missing value is never a pass.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CHECKS } from '../../src/calc/checks/index.js';
import type { CheckId, CheckResult, CircuitContext, Status } from '../../src/calc/types.js';
import { worst } from '../../src/calc/checks/result.js';
import { context } from '../helpers/context.js';
import { assess } from '../../src/calc/assess.js';
import { project } from '../helpers/project.js';

const MEASURED_CHECKS: CheckId[] = ['continuity', 'ring', 'insulation', 'polarity', 'zs-measured', 'rcd', 'rcd-tt'];
const checks = CHECKS.filter(([id]) => MEASURED_CHECKS.includes(id));

const statuses = (ctx: CircuitContext) => Object.fromEntries(checks.map(([id, check]) => [id, check(ctx).status])) as Record<string, Status>;
const all = (ctx: CircuitContext) => Object.fromEntries(CHECKS.map(([id, check]) => [id, check(ctx)])) as Record<string, CheckResult>;
/** the circuit's verdict: the worst of its checks, those that do not apply left out */
const verdictOf = (s: Record<string, CheckResult>): Status => worst(Object.values(s).map((k) => k.status).filter((x) => x !== 'n/a'));

/** a standard, a clause or table, or common practice: what a pass's basis names */
const RULE_NAMED = /IEC \d|BS \d|BS EN \d|Table \d|\b\d{3}\.\d|common practice/;

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
  fc.oneof({ arbitrary: fc.constant({ breaking_ka: '10', let_through_a2s: '3000' }), weight: 3 }, { arbitrary: fc.record({
    breaking_ka: fc.constantFrom('3', '6', '10'),
    let_through_a2s: fc.constantFrom('3000', '12000', '40000'),
    cpc_in_cable: fc.constantFrom('no'),
    cpc_protected: fc.constantFrom('yes', 'no'),
    sockets: fc.constantFrom('yes', 'no'),
    outdoors: fc.constantFrom('yes', 'no'),
    rcd_exemption: fc.constantFrom('documented risk assessment'),
    concealed: fc.constantFrom('yes', 'no'),
    kind: fc.constantFrom('power', 'lighting', 'heating'),
  }, { requiredKeys: [] }), weight: 2 }),
  fc.boolean(),
).map(([device, rating_a, [live_mm2, cpc_mm2], ring, rcd_ma, rcd_type, phases, attrs, light]) => ({
  device, rating_a, live_mm2: live_mm2!, cpc_mm2: cpc_mm2!, ring, phases,
  // a design current the device carries, and a short run, often enough for a circuit to pass overall
  ...(light ? { ib_a: String(Number(rating_a) / 2), length_m: '8' } : {}),
  ...(rcd_ma ? { rcd_ma } : {}), ...(rcd_type ? { rcd_type } : {}), ...attrs,
}));

/**
 * Circuit fields whose absence means "not known", or whose default is the stricter choice
 * (cpc_protected: no; sockets on kind power: yes): removing one may never turn anything into a pass.
 * Left out, with the reason: kind (required), sockets on other kinds, outdoors and concealed
 * (CONTRACT.md's defaults say what a circuit ordinarily is, and they are the less strict choice: taking
 * one away can turn an additional-protection fail into n/a), cpc_in_cable (a cable's cpc core is the
 * ordinary case), rcd_type (an unrecorded type takes the general type's maximum times, the stricter;
 * but a time-delayed device's minimum time — `attention`, selectivity lost, not a safety limit — is
 * then not checked, so removing it can turn that attention into a pass: found by this property).
 */
/** The tests of an RCD itself: they apply only where the circuit records one. */
const RCD_TESTS: ReadonlySet<string> = new Set(['rcd', 'rcd-tt']);
const REMOVABLE = ['breaking_ka', 'let_through_a2s', 'cpc_protected', 'rcd_exemption', 'rcd_ma'] as const;
const removable = (c: Record<string, string>) => [
  ...REMOVABLE.filter((k) => c[k] !== undefined && !(k === 'rcd_ma' && c.rcd_type === undefined)),
  ...(c.sockets !== undefined && (c.kind ?? 'power') === 'power' ? ['sockets'] : []),
];

const supply = fc.record({
  earthing: fc.constantFrom('TN-S', 'TN-C-S', 'TT'),
  ze_ohm: decimal(0.05, 0.5),
  ra_ohm: decimal(5, 400, 0),
  pfc_ka: decimal(0.5, 8, 1),
}, { requiredKeys: ['earthing'] });

const extra = fc.record({
  expected: fc.option(decimal(0.05, 1.5), { nil: undefined }),
  zdb: fc.option(decimal(0.1, 1.2), { nil: undefined }),
  premises: fc.constantFrom('dwelling' as const, 'other' as const),
  set: fc.constantFrom('iec-60364', 'bs-7671'),
}).map(({ expected, zdb, premises, set }) => ({
  derived: { r1r2_expected_ohm: expected === undefined ? null : Number(expected) },
  board: zdb === undefined ? {} : { zdb_ohm: zdb },
  premises,
  rules: { set },
}));

/** A check that queried two readings against each other (e.g. Zs below R1+R2): removing one of the
 * pair removes the query; the circuit verdict is still held to the property (the other check needs it). */
const crossQuery = (basis: string) => /check the readings/.test(basis);

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

/** A sound circuit, often passing everything: so the property also meets circuits that pass. */
const soundCircuit = fc.tuple(fc.constantFrom('16', '20', '32'), fc.constantFrom('A', 'F')).map(([rating_a, rcd_type]) => ({
  device: 'rcbo:B', rating_a, live_mm2: '4', cpc_mm2: '1.5', ring: 'no', phases: '1', ib_a: String(Number(rating_a) / 2),
  length_m: '10', rcd_ma: '30', rcd_type, breaking_ka: '10', let_through_a2s: '3000', cpc_protected: 'yes',
}));
const sound = fc.tuple(soundCircuit, fc.constantFrom('TN-S', 'TN-C-S')).chain(([c, earthing]) => {
  // R1+R2 at 20 °C: 10 m × (4.61 + 12.1) mΩ/m = 0.167 Ω (IEC 60228)
  const x = { derived: { r1r2_expected_ohm: 0.167 }, board: {}, premises: 'other' as const, rules: { set: 'iec-60364' } };
  const s = { earthing, ze_ohm: '0.25', pfc_ka: '2' };
  return fc.record({
    r1r2_ohm: fc.constantFrom('0.17', '0.18'), ir_ll_mohm: fc.constant('>999'), ir_le_mohm: fc.constant('>999'),
    ir_test_v: fc.constant('500'), zs_ohm: fc.constantFrom('0.44', '0.47'), rcd_1x_ms: fc.constantFrom('18', '25'),
    rcd_5x_ms: fc.constantFrom('8', '12'), polarity: fc.constant('ok'), rcd_button: fc.constant('ok'),
  }).map((r) => ({ c: c as Record<string, string>, s: s as typeof s & { ra_ohm?: string }, x, r: r as Record<string, string> }));
});

describe('a missing value is never a pass (fast-check)', () => {
  it('removing any one reading, design value or attribute never turns a check or the circuit verdict into pass', () => {
    let passes = 0;
    let checkPasses = 0;
    let judged = 0;
    fc.assert(fc.property(fc.oneof({ arbitrary: scenario, weight: 4 }, { arbitrary: sound, weight: 1 }), ({ c, s, x, r }) => {
      const full = all(context(c, r, s, 0.4, x));
      const removals: [string, () => CircuitContext][] = [
        ...Object.keys(r).map((f): [string, () => CircuitContext] => [f, () => { const rest = { ...r }; delete rest[f]; return context(c, rest, s, 0.4, x); }]),
        ...removable(c).map((f): [string, () => CircuitContext] => [f, () => { const rest: Record<string, string> = { ...c }; delete rest[f]; return context(rest, r, s, 0.4, x); }]),
        ...(['pfc_ka', 'ze_ohm', 'ra_ohm'] as const).filter((f) => s[f] !== undefined)
          .map((f): [string, () => CircuitContext] => [f, () => { const rest = { ...s }; delete rest[f]; return context(c, r, rest, 0.4, x); }]),
        // zdb_ohm is not removed: a board with none is at the origin (CONTRACT.md), its Zdb is Ze, not unknown
        ...(x.premises === 'other' ? [['premises', () => context(c, r, s, 0.4, { ...x, premises: 'dwelling' })] as [string, () => CircuitContext]] : []),
      ];
      for (const [field, make] of removals) {
        const after = all(make());
        for (const [id] of CHECKS) {
          if (full[id]!.status !== 'pass' && full[id]!.status !== 'n/a') judged += 1;
          if (after[id]!.status === 'pass') {
            checkPasses += 1;
            // a check that did not apply may come to apply (e.g. sockets: no removed on a power circuit) and pass
            if (full[id]!.status === 'n/a') continue;
            if (full[id]!.status !== 'pass' && crossQuery(full[id]!.basis)) continue;
            expect(full[id]!.status, `${id} after removing ${field}: ${full[id]!.basis}`).toBe('pass');
          }
        }
        if (verdictOf(after) === 'pass') {
          passes += 1;
          // Removing rcd_ma says the circuit has no RCD, so that RCD's own tests go with it (an RCBO
          // without it is an input error, see rule-inputs.test.ts). A query of two values against
          // each other (e.g. Zdb below Ze) goes with either of them, as at the check level above;
          // where the other check still needs the removed value, it is not verified and the verdict
          // stays short of pass. Found by this property (TT, Zdb 0.19 Ω measured below Ze 0.36 Ω,
          // Ze removed: the measured Zs still verifies the loop). Nothing else may come to pass.
          const kept = Object.fromEntries(Object.entries(full).filter(([id, k]) =>
            !(field === 'rcd_ma' && RCD_TESTS.has(id)) && !(k.status !== 'pass' && crossQuery(k.basis))));
          expect(verdictOf(kept), `circuit verdict after removing ${field}`).toBe('pass');
        }
      }
    }), { numRuns: 100 });
    // the generators must reach passing checks and circuits, and checks that do not pass, or the
    // property says nothing
    expect(passes).toBeGreaterThan(5);
    expect(checkPasses).toBeGreaterThan(2000);
    expect(judged).toBeGreaterThan(2000);
  });

  it('every pass names the rule that earned it: a standard, a clause or table, or common practice', () => {
    let seen = 0;
    fc.assert(fc.property(scenario, ({ c, s, x, r }) => {
      for (const [id, check] of CHECKS) {
        const k = check(context(c, r, s, 0.4, x));
        if (k.status !== 'pass') continue;
        seen += 1;
        expect(k.basis, id).toMatch(RULE_NAMED);
      }
    }), { numRuns: 150 });
    expect(seen).toBeGreaterThan(300);
  });

  it('relaxing a rule (a departure from the set) never turns a check into pass (assess)', () => {
    const relax = fc.record({
      cmin: fc.constantFrom(0.97, 1.0),
      measured_zs_factor: fc.constantFrom(0.9, 1.0),
      vd_lighting_percent: fc.constantFrom(4, 8),
      vd_other_percent: fc.constantFrom(6, 10),
      final_fixed_limit_a: fc.constantFrom(10, 20),
      final_socket_limit_a: fc.constantFrom(16, 32),
      r1r2_tolerance_percent: fc.constantFrom(50),
    }, { requiredKeys: [] });
    let compared = 0;
    fc.assert(fc.property(scenario, relax, fc.option(fc.constantFrom('1', '5'), { nil: undefined }), ({ c, s, r }, rules, longer) => {
      const supplyFile = { ...s, phases: 3 };
      const base = project([c], { supply: supplyFile }, { 1: r });
      const loose = project([{ ...c, ...(longer ? { disconnect_s: longer } : {}) }], { supply: supplyFile, rules }, { 1: r });
      const before = assess(base).circuits[0]!.checks;
      const after = assess(loose).circuits[0]!.checks;
      for (const k of after) {
        const b = before.find((x) => x.id === k.id)!;
        compared += 1;
        if (k.status === 'pass') expect(b.status, `${k.id} relaxed by ${JSON.stringify(rules)} ${longer ?? ''}: ${k.basis}`).toBe('pass');
        // every pass of the whole assessment (departures and the tree applied) names its rule too
        if (k.status === 'pass') expect(k.basis, k.id).toMatch(RULE_NAMED);
      }
      if (verdictOf(Object.fromEntries(after.map((k) => [k.id, k]))) === 'pass') {
        expect(verdictOf(Object.fromEntries(before.map((k) => [k.id, k]))), 'circuit verdict after relaxing').toBe('pass');
      }
    }), { numRuns: 150 });
    expect(compared).toBeGreaterThan(1000);
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
    }), { numRuns: 100 });
  });
});
