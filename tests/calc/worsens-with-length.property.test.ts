// Design Zs and the voltage drop only worsen as a run grows (R1+R2 and the circuit's own drop are
// its length times a resistance per metre: IEC 60228 gives conductor resistance per unit length,
// and Ohm's law the rest; the limits, max Zs and the percentage allowed, do not depend on the
// length). The search for the longest run relies on that to judge fewer lengths. Here: the
// property itself, on circuits of every kind, and the search giving what judging every length it
// asks about gives, to the 0.1 m, the checks named and the line.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LENGTH_CHECKS, longestRun, PASSES, runWords, Trials, type Meets } from '../../src/calc/design/max-length.js';
import { TrialContext } from '../../src/calc/trial-context.js';
import { zsDesign } from '../../src/calc/checks/zs-design.js';
import { voltageDropCheck } from '../../src/calc/checks/voltage-drop.js';
import type { Check, CircuitContext, LengthCheck } from '../../src/calc/types.js';
import { context } from '../helpers/context.js';

const NOT_FAIL: Meets = (s) => s !== 'fail';

/** A circuit of any kind the length checks meet: device, sizes, ring, phases, supply, board, fault level. */
const circuits = fc.record({
  device: fc.constantFrom('mcb:B', 'mcb:C', 'mcb:D', 'fuse:gG', 'rcbo:B', 'rcbo:C'),
  rating: fc.constantFrom(6, 10, 16, 20, 25, 32, 40),
  sizes: fc.constantFrom(['1', '1'], ['1.5', '1'], ['2.5', '1.5'], ['4', '1.5'], ['6', '2.5'], ['10', '4'], ['16', '6'], ['25', '16'], ['35', '16']),
  load: fc.double({ min: 0.05, max: 1, noNaN: true }),
  ring: fc.boolean(),
  three: fc.boolean(),
  lighting: fc.boolean(),
  tt: fc.boolean(),
  ze: fc.double({ min: 0.01, max: 0.9, noNaN: true }),
  /** the impedance a board adds to Ze, where its Zdb is measured */
  upstream: fc.option(fc.double({ min: 0, max: 0.6, noNaN: true }), { nil: undefined }),
  pfc: fc.option(fc.double({ min: 0.2, max: 16, noNaN: true }), { nil: undefined }),
  letThrough: fc.option(fc.integer({ min: 1000, max: 200000 }), { nil: undefined }),
  own: fc.double({ min: 0.5, max: 400, noNaN: true }),
}).map((g) => {
  const ring = g.ring && !g.three && g.sizes[0] === '2.5';
  const fields: Record<string, string> = {
    device: g.device, rating_a: String(g.rating), ib_a: String(Math.max(0.1, Math.round(g.rating * g.load * 10) / 10)),
    live_mm2: g.sizes[0]!, cpc_mm2: g.sizes[1]!, length_m: String(g.own), kind: g.lighting ? 'lighting' : 'power',
    ...(ring ? { ring: 'yes' } : {}), ...(g.three ? { phases: '3' } : {}),
    ...(g.letThrough !== undefined ? { let_through_a2s: String(g.letThrough) } : {}),
    ...(g.tt || g.device.startsWith('rcbo') ? { rcd_ma: '30', rcd_type: 'A' } : {}),
  };
  const ze = g.tt ? g.ze * 60 : g.ze;
  const supply: Record<string, unknown> = g.tt
    ? { earthing: 'TT', ze_ohm: String(ze) }
    : { ze_ohm: String(ze), ...(g.pfc !== undefined ? { pfc_ka: String(g.pfc) } : {}) };
  const board: Record<string, string> = g.upstream !== undefined ? { zdb_ohm: String(ze + g.upstream) } : {};
  return { fields, supply, board, own: g.own };
});

const contextOf = (c: { fields: Record<string, string>; supply: Record<string, unknown>; board: Record<string, string> }): CircuitContext =>
  context(c.fields, {}, c.supply, undefined, { board: c.board });

/** The trials with every check bare: no check says it only worsens, so the search judges every length it asks about. */
class Bare extends TrialContext {
  override check(check: Check): LengthCheck {
    const prepared = super.check(check);
    const bare: LengthCheck = (ctx) => prepared(ctx);
    if (prepared.passesAtNoLength) bare.passesAtNoLength = prepared.passesAtNoLength;
    return bare;
  }
}

/** Trials that count the lengths they work out. */
function counted(make: (ctx: CircuitContext) => TrialContext, ctx: CircuitContext) {
  const count = { lengths: 0 };
  const tc = make(ctx);
  const at = tc.at.bind(tc);
  tc.at = (l: number) => { count.lengths += 1; return at(l); };
  return { trials: new Trials(tc), count };
}

describe('design Zs and the voltage drop only worsen as the run grows', () => {
  for (const check of [zsDesign, voltageDropCheck] as LengthCheck[]) {
    it(`${check === zsDesign ? 'design Zs' : 'voltage drop'}: a length that passes has every shorter one pass; one that fails, every longer one fail`, () => {
      expect(check.worsensWithLength).toBe(true);
      const lengths = fc.array(fc.double({ min: 0.5, max: 5000, noNaN: true }), { minLength: 2, maxLength: 8 });
      fc.assert(fc.property(circuits, lengths, (c, ls) => {
        const tc = new TrialContext(contextOf(c));
        const judged = [...ls].sort((a, b) => a - b).map((l) => check(tc.at(l)).status);
        for (let i = 1; i < judged.length; i++) {
          if (judged[i] === 'pass' && judged[i - 1] !== 'pass') return false;
          if (judged[i - 1] === 'fail' && judged[i] !== 'fail') return false;
        }
        return true;
      }), { numRuns: 400 });
    });
  }
});

describe('the search that knows which checks only worsen finds what judging every length finds', () => {
  const SETS: [string, readonly Check[]][] = [
    ['all three length checks', LENGTH_CHECKS], ['design Zs and the drop', [zsDesign, voltageDropCheck]], ['design Zs alone', [zsDesign]], ['the drop alone', [voltageDropCheck]],
  ];
  for (const [what, checks] of SETS) {
    it(`${what}: the same length, the same checks named and the same line, from any own length`, () => {
      fc.assert(fc.property(circuits, fc.constantFrom(PASSES, NOT_FAIL), (c, meets) => {
        const ctx = contextOf(c);
        const fast = new Trials(new TrialContext(ctx));
        const plain = new Trials(new Bare(ctx));
        const run = longestRun(fast, c.own, checks, meets);
        expect(run).toEqual(longestRun(plain, c.own, checks, meets));
        if (meets === PASSES) expect(runWords(run, fast, c.own, checks)).toBe(runWords(run, plain, c.own, checks));
      }), { numRuns: 300 });
    });
  }

  it('judges fewer lengths for a circuit where no length passes, the usual case of a breaker on a high fault level with no let-through known', () => {
    // mcb:B 32 A on 2.5/1.5 mm², 1.5 kA at the board and no maker's let-through: the adiabatic
    // check is not met at the board's fault current at any length (IEC 60364-5-54, 543.1.2), and
    // the line says how far design Zs and the drop alone would allow
    const ctx = context({ length_m: '18' }, {}, { ze_ohm: '0.35', pfc_ka: '1.5' });
    const fast = counted((x) => new TrialContext(x), ctx);
    const plain = counted((x) => new Bare(x), ctx);
    const words = runWords(longestRun(fast.trials, 18), fast.trials, 18);
    expect(words).toBe(runWords(longestRun(plain.trials, 18), plain.trials, 18));
    expect(words).toMatch(/^none: the adiabatic check passes at no length .*; design Zs and voltage drop from the origin alone would allow up to [0-9.]+ m$/);
    expect(fast.count.lengths).toBeLessThanOrEqual(plain.count.lengths / 2); // 7 against 14
  });
});
