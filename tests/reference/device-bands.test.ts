// The band edges of the standards, and facts of the trade about fuses.
import { describe, expect, it } from 'vitest';
import { characteristic, deviceFamily, operatingTime } from '../../src/calc/devices/index.js';
import { DEVICE_CODES, type DeviceCode } from '../../src/reference/device-codes.js';

const BREAKERS = ['mcb:B', 'mcb:C', 'mcb:D', 'rcbo:B', 'rcbo:C', 'rcbo:D'] as const;
const LOWER = { B: 3, C: 5, D: 10 } as const;
const UPPER = { B: 5, C: 10, D: 20 } as const;
const typeOf = (code: (typeof BREAKERS)[number]) => code.slice(-1) as 'B' | 'C' | 'D';
const cases = BREAKERS.flatMap((code) => deviceFamily(code).ratings_a.map((r) => [code, r] as const));
const t = (code: DeviceCode, rating: number, current: number) => operatingTime({ code, rating_a: rating }, current);

describe('circuit-breaker band edges (IEC 60898-1 Table 7; IEC 61009-1 the same)', () => {
  it.each(cases)('%s %i A', (code, In) => {
    const hour = In <= 63 ? 3600 : 7200;
    // 1.13 In: no trip within 1 h (2 h above 63 A)
    expect(t(code, In, 1.13 * In).fastest_s).toBeGreaterThanOrEqual(hour);
    expect(t(code, In, 1.13 * In).slowest_s).toBeNull();
    // 1.45 In: trip within 1 h (2 h above 63 A)
    expect(t(code, In, 1.45 * In).slowest_s).toBeLessThanOrEqual(hour);
    // 2.55 In: after more than 1 s, within 60 s (In ≤ 32 A) or 120 s (In > 32 A)
    expect(t(code, In, 2.55 * In).slowest_s).toBeLessThanOrEqual(In <= 32 ? 60 : 120);
    expect(t(code, In, 2.55 * In).fastest_s).toBeGreaterThanOrEqual(1);
    // lower instantaneous multiple: no trip within 0.1 s; upper: trip within 0.1 s
    const type = typeOf(code);
    expect(t(code, In, LOWER[type] * In).fastest_s).toBeGreaterThanOrEqual(0.1);
    expect(t(code, In, UPPER[type] * In).slowest_s).toBeLessThanOrEqual(0.1);
  });
  it('B: at 3 In does not trip within 0.1 s, at 5 In trips within 0.1 s', () => {
    // IEC 60898-1 Table 7, tests d and e for type B
    expect(t('mcb:B', 16, 48).fastest_s).toBeGreaterThanOrEqual(0.1);
    expect(t('mcb:B', 16, 80).slowest_s).toBeLessThanOrEqual(0.1);
    // and just below 5 In only the thermal release is relied on: slower than 0.1 s
    expect(t('mcb:B', 16, 79.9).slowest_s).toBeGreaterThan(0.1);
  });
});

describe('fuses: facts of the trade (common practice)', () => {
  it('a 30 A semi-enclosed fuse at 140 A opens between 0.4 s and 1.5 s', () => {
    const s = t('fuse:bs3036', 30, 140).slowest_s!;
    expect(s).toBeGreaterThanOrEqual(0.4);
    expect(s).toBeLessThanOrEqual(1.5);
  });
  it('a 15 A element at 30 A takes several seconds (2–60 s)', () => {
    const s = t('fuse:bs3036', 15, 30).slowest_s!;
    expect(s).toBeGreaterThanOrEqual(2);
    expect(s).toBeLessThanOrEqual(60);
  });
  it('a 5 A element at 30 A opens within 0.4 s', () => {
    expect(t('fuse:bs3036', 5, 30).slowest_s).toBeLessThanOrEqual(0.4);
  });
  it('no fuse operates at its rated current; no breaker at its rating either', () => {
    for (const code of DEVICE_CODES) {
      for (const r of deviceFamily(code).ratings_a) {
        expect(t(code, r, r)).toEqual({ slowest_s: null, fastest_s: null });
      }
    }
  });
  it('a BS 3036 element is not relied on below 2 In', () => {
    // REFERENCE.md: not guaranteed to open below about 2 × In
    expect(t('fuse:bs3036', 20, 39.9).slowest_s).toBeNull();
    expect(t('fuse:bs3036', 20, 40).slowest_s).not.toBeNull();
  });
});

describe('gG conventional currents (IEC 60269-1 Table 2, from memory)', () => {
  it.each([16, 32, 63, 100, 200])('%i A: carries 1.25 In, operates at 1.6 In within the conventional time', (In) => {
    const hours = In <= 63 ? 1 : In <= 160 ? 2 : 3;
    expect(t('fuse:gG', In, 1.25 * In).slowest_s).toBeNull();
    expect(t('fuse:gG', In, 1.25 * In).fastest_s).toBe(hours * 3600);
    expect(t('fuse:gG', In, 1.6 * In).slowest_s).toBe(hours * 3600);
  });
});

describe('family data', () => {
  it('names the standard, the ratings and a breaking capacity for every code', () => {
    for (const code of DEVICE_CODES) {
      const f = deviceFamily(code);
      expect(f.code).toBe(code);
      expect(f.ratings_a.length).toBeGreaterThan(0);
      expect([...f.ratings_a].sort((a, b) => a - b)).toEqual(f.ratings_a);
      expect(f.breaking_ka).toBeGreaterThan(0);
    }
    expect(deviceFamily('fuse:bs3036').ratings_a).toEqual([5, 15, 20, 30, 45, 60, 100]); // REFERENCE.md
    expect(deviceFamily('fuse:bs3036').breaking_ka).toBe(1); // BS 3036 category S1A, REFERENCE.md
    expect(deviceFamily('mcb:B').standard).toBe('IEC 60898-1');
    expect(deviceFamily('rcbo:C').standard).toBe('IEC 61009-1');
  });
  it('has a characteristic for every rating of BS 3036 and of BS 7671 Table 41.4', () => {
    for (const r of [5, 15, 20, 30, 45, 60, 100]) expect(characteristic({ code: 'fuse:bs3036', rating_a: r })).not.toBeNull();
    for (const r of [6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200]) expect(characteristic({ code: 'fuse:gG', rating_a: r })).not.toBeNull();
  });
});
