// Properties every characteristic must have, over every family and rating the library knows.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  characteristic, currentForTime, deviceFamily, maxZs, operatingTime, type Device,
} from '../../src/calc/devices/index.js';
import { DEVICE_CODES } from '../../src/reference/device-codes.js';

const known: Device[] = DEVICE_CODES.flatMap((code) =>
  deviceFamily(code).ratings_a.map((rating_a) => ({ code, rating_a })).filter((d) => characteristic(d) !== null));
const device = fc.constantFrom(...known);
/** log-uniform, 0.1 A to 100 kA */
const current = fc.double({ min: -1, max: 5, noNaN: true }).map((e) => 10 ** e);
/** log-uniform, 3 ms to 30 000 s */
const time = fc.double({ min: -2.5, max: 4.5, noNaN: true }).map((e) => 10 ** e);
const slowest = (d: Device, i: number) => operatingTime(d, i).slowest_s ?? Infinity;
const close = (a: number, b: number, rel: number) => Math.abs(a - b) <= rel * Math.abs(b);

describe('device characteristics (properties, fast-check)', () => {
  it('covers every family with a published characteristic (BS 88-3 has none: REFERENCE.md withdraws its one point)', () => {
    expect(new Set(known.map((d) => d.code))).toEqual(new Set(DEVICE_CODES.filter((c) => c !== 'fuse:bs88-3')));
  });

  it('operating time never increases as the current rises (both edges)', () => {
    // physical: a larger current heats the element faster and pulls the armature harder
    fc.assert(fc.property(device, current, current, (d, a, b) => {
      const [lo, hi] = a <= b ? [a, b] : [b, a];
      expect(slowest(d, hi)).toBeLessThanOrEqual(slowest(d, lo));
      const f1 = operatingTime(d, lo).fastest_s;
      const f2 = operatingTime(d, hi).fastest_s;
      if (f1 !== null && f2 !== null) expect(f2).toBeLessThanOrEqual(f1);
    }));
  });

  it('the fastest edge never lies above the slowest', () => {
    fc.assert(fc.property(device, current, (d, i) => {
      const { slowest_s, fastest_s } = operatingTime(d, i);
      if (slowest_s !== null && fastest_s !== null) expect(fastest_s).toBeLessThanOrEqual(slowest_s * (1 + 1e-12));
    }));
  });

  it('t(Ia(t)) is t within 1 %, except at a corner of the edge, where it is shorter', () => {
    fc.assert(fc.property(device, time, (d, t) => {
      const ia = currentForTime(d, t);
      if (ia === null) return;
      const back = operatingTime(d, ia).slowest_s;
      expect(back).not.toBeNull();
      expect(back!).toBeLessThanOrEqual(t * (1 + 1e-9));
      const corner = characteristic(d)!.slowest.points.some((p) => close(ia, p.current_a, 1e-9));
      if (!corner) expect(close(back!, t, 0.01)).toBe(true);
    }));
  });

  it('Ia(t(I)) is I within 1 %, except on a flat part of the edge, where it is lower', () => {
    fc.assert(fc.property(device, current, (d, i) => {
      const t = operatingTime(d, i).slowest_s;
      if (t === null) return;
      const ia = currentForTime(d, t);
      expect(ia).not.toBeNull();
      expect(ia!).toBeLessThanOrEqual(i * (1 + 1e-9));
      const flat = close(operatingTime(d, ia!).slowest_s!, t, 1e-9) && !close(ia!, i, 0.01);
      if (!flat) expect(close(ia!, i, 0.01)).toBe(true);
    }));
  });

  it('max Zs never increases as the required time gets shorter', () => {
    fc.assert(fc.property(device, time, time, fc.double({ min: 100, max: 400, noNaN: true }), (d, a, b, u0) => {
      const [short, long] = a <= b ? [a, b] : [b, a];
      const zShort = maxZs(d, short, u0, 0.95);
      const zLong = maxZs(d, long, u0, 0.95);
      if (zShort === null) return;
      expect(zLong).not.toBeNull();
      expect(zShort.max_zs_ohm).toBeLessThanOrEqual(zLong!.max_zs_ohm * (1 + 1e-12));
    }));
  });

  it('max Zs × Ia = U0 × Cmin (the definition)', () => {
    fc.assert(fc.property(device, time, fc.double({ min: 0.8, max: 1.1, noNaN: true }), (d, t, cmin) => {
      const z = maxZs(d, t, 230, cmin);
      if (z) expect(z.max_zs_ohm * z.ia_a).toBeCloseTo(230 * cmin, 9);
    }));
  });
});
