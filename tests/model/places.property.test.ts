// toPlaces must give exactly the double that Number(n.toFixed(places)) gives (ECMA-262,
// Number.prototype.toFixed: the whole number of units of the last place nearest to n, the larger
// of two equally near): design values, check values and limits are rounded through it, and a pack
// and its JSON must read the same whichever of the two rounded them.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { toPlaces } from '../../src/model/units.js';

const same = (n: number, places: number) => Object.is(toPlaces(n, places), Number(n.toFixed(places)));

describe('toPlaces', () => {
  it('equals Number(n.toFixed(places)) for any double', () => {
    fc.assert(fc.property(fc.double({ noNaN: false }), fc.integer({ min: 0, max: 8 }), (n, places) => same(n, places)), { numRuns: 20000 });
  });
  it('equals it for values of the size a circuit has (ohms, volts, percent, amperes)', () => {
    fc.assert(fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.integer({ min: 0, max: 6 }), (n, places) => same(n, places)), { numRuns: 20000 });
  });
  it('equals it where n × 10^places is 2^52 or more, where a product loses the units', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 6 }), fc.double({ min: 2 ** 50, max: 2 ** 64, noNaN: true }), (places, big) => same(big / 10 ** places, places)), { numRuns: 20000 });
  });
  it('equals it on decimal ties and their neighbours one ulp away, where rounding is decided', () => {
    // d5 × 10^-(k+1) is a tie at k places: 0.125 → 0.13 at 2 places, if 0.125 is stored exactly
    fc.assert(fc.property(fc.integer({ min: 0, max: 9_999_999 }), fc.integer({ min: 0, max: 6 }), fc.integer({ min: 0, max: 6 }), (d, places, shift) => {
      const x = Number(`${d}5e-${places + 1 + shift}`) * 10 ** shift;
      return [x, x * (1 + 2 ** -52), x * (1 - 2 ** -53), -x, Number(`${d}5e-${places + 1}`)].every((v) => same(v, places));
    }), { numRuns: 20000 });
    expect(toPlaces(0.125, 2)).toBe(0.13); // stored exactly: the tie goes to the larger
    expect(toPlaces(1.005, 2)).toBe(1); // stored just below 1.005
    expect(toPlaces(2.5, 0)).toBe(3);
    expect(Object.is(toPlaces(-0.0001, 3), -0)).toBe(true); // "-0.000"
    expect(Object.is(toPlaces(-0, 3), 0)).toBe(true); // "0.000"
  });
  it('equals it near every power of two and ten, and where the product nears 2^52', () => {
    for (let e = -30; e <= 60; e++) {
      for (const m of [1, 1 - 2 ** -53, 1 + 2 ** -52, 1.5, 0.75]) {
        for (let places = 0; places <= 6; places++) expect(same(m * 2 ** e, places), `${m}·2^${e} at ${places}`).toBe(true);
      }
    }
    for (let e = -12; e <= 16; e++) {
      for (const m of [1, 9.995, 9.9995, 0.99951, 4.4449999, 4.5]) {
        for (let places = 0; places <= 6; places++) expect(same(m * 10 ** e, places), `${m}e${e} at ${places}`).toBe(true);
      }
    }
    for (let places = 0; places <= 6; places++) {
      const edge = 2 ** 52 / 10 ** places;
      for (const v of [edge, edge * (1 - 2 ** -52), edge * (1 + 2 ** -52), edge - 0.5, edge / 2 + 0.5]) expect(same(v, places), `${v} at ${places}`).toBe(true);
    }
  });
});
