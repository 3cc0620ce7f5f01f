// toSignificant must give exactly the double that Number(n.toPrecision(sig)) gives (ECMA-262,
// Number.prototype.toPrecision: the nearest `sig`-digit decimal, ties to the larger magnitude):
// every basis line and derived value is written through it, and a pack must read the same
// whichever of the two computed it.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { toSignificant } from '../../src/model/units.js';

const same = (n: number, sig: number) => Object.is(toSignificant(n, sig), Number(n.toPrecision(sig)));

describe('toSignificant', () => {
  it('equals Number(n.toPrecision(sig)) for any double', () => {
    fc.assert(fc.property(fc.double({ noNaN: true }), fc.integer({ min: 1, max: 8 }), (n, sig) => same(n, sig)), { numRuns: 20000 });
  });
  it('equals it on decimal ties and their neighbours one ulp away, where rounding is decided', () => {
    // d5 × 10^e is a tie at every precision of d's digits: 0.125 → 0.13 at 2 digits (half up)
    fc.assert(fc.property(fc.integer({ min: 0, max: 999_999 }), fc.integer({ min: -12, max: 12 }), fc.integer({ min: 1, max: 6 }), (d, e, sig) => {
      const x = Number(`${d}5e${e}`);
      return [x, x * (1 + 2 ** -52), x * (1 - 2 ** -53), -x].every((v) => same(v, sig));
    }), { numRuns: 20000 });
    expect(toSignificant(0.125, 2)).toBe(0.13);
    expect(toSignificant(1.005, 3)).toBe(1); // 1.005 is stored just below 1.005
  });
  it('equals it across powers of ten, where the digit count changes', () => {
    for (let e = -30; e <= 30; e++) {
      for (const m of [1, 1 - 2 ** -53, 1 + 2 ** -52, 9.995, 9.9995, 0.99951]) {
        for (let sig = 1; sig <= 6; sig++) expect(same(m * 10 ** e, sig), `${m}e${e} at ${sig}`).toBe(true);
      }
    }
  });
});
