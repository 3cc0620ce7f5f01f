// fmt writes a number for messages and tables: below 10^sig, the number Number(n.toPrecision(sig))
// gives, written as JavaScript writes a number (ECMA-262, Number.prototype.toPrecision and
// Number::toString); from 10^sig up, the whole number nearest. At 3 digits, the text of a number
// already written is looked up, not written again: what it gives must not depend on what was
// written before, nor on the look-up being emptied when it fills.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fmt } from '../../src/model/units.js';

/** The text as ECMA-262 gives it, with nothing kept between calls. */
const afresh = (n: number, sig: number) => (!Number.isFinite(n) ? String(n) : Math.abs(n) >= 10 ** sig ? String(Math.round(n)) : String(Number(n.toPrecision(sig))));

describe('fmt', () => {
  it('writes any double as ECMA-262 does, at 3 digits and at others, in any order and with repeats', () => {
    const values = fc.oneof(fc.double(), fc.double({ min: -2000, max: 2000, noNaN: true }), fc.constantFrom(0, -0, 0.4, 0.1, 32, 999.5, 1000, -999.4, 1.366, 2.185));
    fc.assert(fc.property(fc.array(fc.tuple(values, fc.constantFrom(3, 3, 3, 2, 4)), { maxLength: 60 }), (calls) => calls.every(([n, sig]) => fmt(n, sig) === afresh(n, sig))), { numRuns: 3000 });
  });

  it('writes a number the same before and after many others have filled and emptied what it keeps', () => {
    const first = [0.4, 1.366, 29756.25, -0.0004, 999.95, 12.345];
    const before = first.map((n) => fmt(n));
    for (let i = 0; i < 20_000; i++) expect(fmt(i / 7)).toBe(afresh(i / 7, 3));
    expect(first.map((n) => fmt(n))).toEqual(before);
    expect(before).toEqual(['0.4', '1.37', '29756', '-0.0004', '1000', '12.3']);
  });

  it('writes 0 and -0 alike, and NaN and the infinities as JavaScript does', () => {
    expect([fmt(-0), fmt(0), fmt(-0)]).toEqual(['0', '0', '0']);
    expect([fmt(NaN), fmt(Infinity), fmt(-Infinity)]).toEqual(['NaN', 'Infinity', '-Infinity']);
  });
});
