// The longest run as the trials find it (a circuit's per-metre values worked once, the check that
// failed last asked first, the adiabatic check's length-free parts kept) against two references
// worked apart from it: the physics, where one check alone sets the length, and a plain walk over
// every 0.1 m with each length's context built afresh from circuits.csv's fields.
import { describe, expect, it } from 'vitest';
import { LENGTH_CHECKS, longestRun, runWords, Trials } from '../../src/calc/design/max-length.js';
import { TrialContext } from '../../src/calc/trial-context.js';
import { zsDesign } from '../../src/calc/checks/zs-design.js';
import { voltageDropCheck } from '../../src/calc/checks/voltage-drop.js';
import { adiabatic } from '../../src/calc/checks/adiabatic.js';
import type { Check, CircuitContext } from '../../src/calc/types.js';
import { context } from '../helpers/context.js';

// IEC 60228 Table 2: copper, maximum resistance at 20 °C, mΩ/m (REFERENCE.md)
const R20: Record<string, number> = { '1': 18.1, '1.5': 12.1, '2.5': 7.41, '4': 4.61, '6': 3.08, '10': 1.83 };
// IEC 60287-1-1 Table 1: copper, α20 = 0.00393 /K; PVC runs at 70 °C (REFERENCE.md)
const hot = (mm2: string) => R20[mm2]! * (1 + 0.00393 * (70 - 20));

const trials = (ctx: CircuitContext) => new Trials(new TrialContext(ctx));
const tenths = (m: number) => Math.floor(m * 10) / 10;

describe('the longest run where one check sets it, against the physics', () => {
  it('design Zs alone, mcb:B 32 A on 2.5/1.5 mm², Ze 0.35 Ω: L = (230 × 0.95 / 160 − 0.35) / (r1 + r2 at 70 °C)', () => {
    // IEC 60364-4-41 / BS 7671 Table 41.3 with Cmin 0.95: Ia = 5 × 32 A, max Zs = 1.37 Ω (REFERENCE.md)
    const maxZs = (230 * 0.95) / (5 * 32);
    const L = ((maxZs - 0.35) * 1000) / (hot('2.5') + hot('1.5')); // 42.4 m
    const ctx = context({ length_m: '20' }, {}, { ze_ohm: '0.35' });
    const run = longestRun(trials(ctx), 20, [zsDesign]);
    expect(run).toEqual({ length_m: tenths(L), beyond: false, limited_by: ['zs-design'] });
  });

  it('design Zs alone on a ring: R1+R2 midway round the ring is a quarter of the end-to-end value (BS 7671 Appendix 3 practice)', () => {
    const maxZs = (230 * 0.95) / (5 * 32);
    const L = (4 * (maxZs - 0.35) * 1000) / (hot('2.5') + hot('1.5')); // 169.8 m
    const ctx = context({ ring: 'yes', length_m: '60' }, {}, { ze_ohm: '0.35' });
    expect(longestRun(trials(ctx), 60, [zsDesign]).length_m).toBe(tenths(L));
  });

  it('design Zs alone on TT with a 300 mA RCD: Zs × IΔn ≤ 50 V (IEC 60364-4-41, 411.5.3)', () => {
    const L = ((50 / 0.3 - 21) * 1000) / (hot('1.5') + hot('1')); // 4,031.7 m: within the 5 km searched
    const ctx = context({ device: 'rcbo:B', rating_a: '16', ib_a: '6', live_mm2: '1.5', cpc_mm2: '1', rcd_ma: '300', rcd_type: 'A', length_m: '30' }, {}, { earthing: 'TT', ze_ohm: '21' });
    expect(longestRun(trials(ctx), 30, [zsDesign]).length_m).toBe(tenths(L));
  });

  it('voltage drop alone, 20 A on 2.5 mm²: 2 × L × R(70 °C) × Ib ≤ 5 % of 230 V (IEC 60364-5-52 Annex G, Table G.52.1)', () => {
    const L = (0.05 * 230 * 1000) / (2 * hot('2.5') * 20); // 32.4 m
    const ctx = context({ length_m: '10' }, {}, { ze_ohm: '0.35' });
    expect(longestRun(trials(ctx), 10, [voltageDropCheck])).toEqual({ length_m: tenths(L), beyond: false, limited_by: ['voltage-drop'] });
  });

  it('voltage drop alone, lighting: 3 % (IEC 60364-5-52 Table G.52.1), 6 A on 1.5 mm²', () => {
    const L = (0.03 * 230 * 1000) / (2 * hot('1.5') * 6); // 39.7 m
    const ctx = context({ kind: 'lighting', device: 'mcb:B', rating_a: '6', ib_a: '6', live_mm2: '1.5', cpc_mm2: '1', length_m: '70' }, {}, { ze_ohm: '0.35' });
    expect(longestRun(trials(ctx), 70, [voltageDropCheck]).length_m).toBe(tenths(L));
  });

  it('design Zs and the adiabatic check turn at the same length on a circuit-breaker, and the run names both, from wherever the search starts', () => {
    // Zs = max Zs exactly where If = U0 × Cmin / Zs falls to Ia = 5 × 32 A (IEC 60364-4-41, 411.4.4;
    // type B instantaneous trip within 0.1 s at 5 In, IEC 60898-1); below Ia the breaker may take
    // seconds, and I²t then exceeds k²S² of the 1.5 mm² cpc (IEC 60364-5-54, 543.1.2)
    const L = (((230 * 0.95) / 160 - 0.35) * 1000) / (hot('2.5') + hot('1.5')); // 43.5 m
    for (const own of [5, 12, 20, 33, 47, 80]) {
      const ctx = context({ ib_a: '6', let_through_a2s: '15000', length_m: String(own) }, {}, { ze_ohm: '0.35', pfc_ka: '1.5' });
      expect(longestRun(trials(ctx), own, LENGTH_CHECKS), `from ${own} m`).toEqual({ length_m: tenths(L), beyond: false, limited_by: ['zs-design', 'adiabatic'] });
    }
  });

  it('both together: the shorter of the two, and the line names the check that sets it', () => {
    const byZs = (((230 * 0.95) / 160 - 0.35) * 1000) / (hot('2.5') + hot('1.5'));
    const byVd = (0.05 * 230 * 1000) / (2 * hot('2.5') * 20);
    expect(byVd).toBeLessThan(byZs);
    const ctx = context({ length_m: '20' }, {}, { ze_ohm: '0.35' });
    const t = trials(ctx);
    const run = longestRun(t, 20, [zsDesign, voltageDropCheck]);
    expect(run.length_m).toBe(tenths(byVd));
    expect(runWords(run, t, 20, [zsDesign, voltageDropCheck])).toBe(`${tenths(byVd)} m, set by voltage drop from the origin`);
  });
});

/** Every check met at this length, each judged on a context built afresh (no trial context, no kept parts). */
function plainPasses(fields: Record<string, string>, supply: Record<string, unknown>, checks: readonly Check[], lengthM: number): boolean {
  const ctx = context({ ...fields, length_m: String(lengthM) }, {}, supply);
  return checks.every((c) => c(ctx).status === 'pass');
}

/** The longest run by a plain walk: the last 0.1 m step that passes before the first that fails. */
function plainRun(fields: Record<string, string>, supply: Record<string, unknown>, checks: readonly Check[], upToM: number): number | null {
  let last: number | null = null;
  for (let tenth = 5; tenth <= upToM * 10; tenth++) {
    const l = tenth / 10;
    if (plainPasses(fields, supply, checks, l)) last = l;
    else if (last !== null) return last;
  }
  return last;
}

describe('the longest run with all three length checks, against a plain walk over every 0.1 m', () => {
  const CASES: [string, Record<string, string>, Record<string, unknown>][] = [
    ['rcbo:B 20 A, 2.5/1.5 mm², Ze 0.2 Ω, maker\'s let-through', { device: 'rcbo:B', rating_a: '20', ib_a: '14', rcd_ma: '30', rcd_type: 'A', let_through_a2s: '12000', length_m: '25' }, { ze_ohm: '0.2', pfc_ka: '2' }],
    ['fuse:gG 20 A, 4/1.5 mm², Ze 0.45 Ω, maker\'s let-through', { device: 'fuse:gG', rating_a: '20', ib_a: '16', live_mm2: '4', cpc_mm2: '1.5', let_through_a2s: '5000', length_m: '15' }, { ze_ohm: '0.45', pfc_ka: '1.2' }],
    ['mcb:C 10 A, 1.5/1 mm², separate cpc, energy class from the job', { device: 'mcb:C', rating_a: '10', ib_a: '6', live_mm2: '1.5', cpc_mm2: '1', let_through_a2s: '9000', length_m: '12' }, { ze_ohm: '0.3', pfc_ka: '1.5' }],
  ];
  for (const [what, fields, supply] of CASES) {
    it(what, () => {
      const ctx = context(fields, {}, supply);
      const own = Number(fields.length_m);
      const fast = longestRun(trials(ctx), own, LENGTH_CHECKS);
      expect(fast.length_m, 'a length passes').not.toBeNull();
      expect(fast.beyond).toBe(false);
      // the plain walk, far enough past the length found to see where it fails
      expect(plainRun(fields, supply, LENGTH_CHECKS, fast.length_m! + 1)).toBe(fast.length_m);
      // and the checks named as the limit are those that fail just beyond it
      const beyond = context({ ...fields, length_m: String(fast.length_m! + 0.1) }, {}, supply);
      for (const id of fast.limited_by) expect(LENGTH_CHECKS.find((c) => c(beyond).id === id)!(beyond).status).not.toBe('pass');
    });
  }
});

describe('the adiabatic check with its length-free parts kept judges as the plain check', () => {
  it('at every length from 0.5 m to 5 km, on a supply whose board fault level is above the far end\'s', () => {
    const ctx = context({ device: 'mcb:B', rating_a: '16', ib_a: '10', let_through_a2s: '15000' }, {}, { ze_ohm: '0.25', pfc_ka: '3' });
    const kept = new TrialContext(ctx);
    const prepared = kept.check(adiabatic);
    expect(prepared).not.toBe(adiabatic); // it is the kept version that is compared here
    for (const l of [0.5, 2, 7.5, 30, 120, 480, 1900, 5000]) {
      const plain = adiabatic(context({ device: 'mcb:B', rating_a: '16', ib_a: '10', let_through_a2s: '15000', length_m: String(l) }, {}, { ze_ohm: '0.25', pfc_ka: '3' }));
      const got = prepared(kept.at(l));
      expect({ status: got.status, value: got.value, limit: got.limit }, `${l} m`).toEqual({ status: plain.status, value: plain.value, limit: plain.limit });
    }
  });
});

describe('a check that passes at no length is not walked over every length', () => {
  /** The adiabatic check on a context built afresh at each length of a fine grid from 0.5 m to 5 km (steps of 1 %). */
  function passesSomewhere(fields: Record<string, string>, supply: Record<string, unknown>): boolean {
    for (let l = 0.5; l <= 5000; l *= 1.01) {
      if (adiabatic(context({ ...fields, length_m: String(l) }, {}, supply)).status === 'pass') return true;
    }
    return adiabatic(context({ ...fields, length_m: '5000' }, {}, supply)).status === 'pass';
  }
  // IEC 60364-5-54, 543.1.2: the cpc must take the energy at the largest earth fault current as well
  // as at the smallest; the largest, at the board, does not change with the run, and the design
  // fault current U0 × Cmin / Zs falls as the run (and Zs) grows (Ohm's law), so where the part at
  // the board does not pass, no length passes. Each case is checked against the plain check itself.
  const CASES: [string, Record<string, string>, Record<string, unknown>, boolean][] = [
    ['mcb:D 16 A on 4/2.5 mm², 6 kA at the board, no let-through known: attention at every length', { device: 'mcb:D', rating_a: '16', ib_a: '9', live_mm2: '4', cpc_mm2: '2.5' }, { ze_ohm: '0.2', pfc_ka: '6' }, true],
    ['mcb:B 32 A on 2.5/1.5 mm², 1.5 kA, no let-through known: attention at every length', {}, { ze_ohm: '0.35', pfc_ka: '1.5' }, true],
    ['gG 32 A, separate 1 mm² cpc, the maker\'s let-through above k²S²: fails at every length', { device: 'fuse:gG', ib_a: '25', live_mm2: '6', cpc_mm2: '1', cpc_in_cable: 'no', let_through_a2s: '90000' }, { ze_ohm: '0.35', pfc_ka: '1.5' }, true],
    ['mcb:B 16 A with the maker\'s let-through within k²S²: passes over a range of lengths', { device: 'mcb:B', rating_a: '16', ib_a: '10', let_through_a2s: '15000' }, { ze_ohm: '0.25', pfc_ka: '3' }, false],
    ['rcbo:B 20 A on TT with a 30 mA RCD: the RCD breaks fast enough at the board\'s fault current', { device: 'rcbo:B', rating_a: '20', ib_a: '14', rcd_ma: '30', rcd_type: 'A' }, { earthing: 'TT', ze_ohm: '21' }, false],
  ];
  for (const [what, fields, supply, nowhere] of CASES) {
    it(what, () => {
      const ctx = context(fields, {}, supply);
      const kept = new TrialContext(ctx);
      const prepared = kept.check(adiabatic);
      expect(prepared.passesAtNoLength?.(kept.at(0.5)), 'the check\'s own answer').toBe(nowhere);
      expect(passesSomewhere(fields, supply), 'the plain check on a 1 % grid').toBe(!nowhere);
      if (nowhere) {
        // the longest run and its line are what the walk over every length gave, from two lengths tried
        let tried = 0;
        const counting = new (class extends TrialContext {
          override at(lengthM: number) { tried += 1; return super.at(lengthM); }
        })(ctx);
        const t = new Trials(counting);
        expect(longestRun(t, 20, [adiabatic])).toEqual({ length_m: null, beyond: false, limited_by: [] });
        expect(runWords(longestRun(t, 20, [adiabatic]), t, 20, [adiabatic])).toMatch(/^none: the adiabatic check passes at no length from 0\.5 m to 5 km \((attention|fail) at 20 m\)$/);
        expect(tried).toBe(2); // 0.5 m, for the fault current there, and 20 m, for the status the line gives
      }
    });
  }
});
