import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { capacity, type CapacityInput } from '../../src/calc/design/capacity.js';

const sizes = [1.5, 2.5, 4, 6, 10, 16, 25, 35];
const base: CapacityInput = { material: 'cu', insulation: 'pvc70', method: 'C', loaded: 2, live_mm2: 2.5, grouped: 1, insulation_mm: 0 };
const iz = (over: Partial<CapacityInput>) => {
  const r = capacity({ ...base, ...over });
  if (!r.ok) throw new Error(r.message);
  return r.capacity;
};

// IEC 60364-5-52 Annex B, copper, 30 °C air — as quoted in REFERENCE.md
const TABLES: [string, CapacityInput['insulation'], 2 | 3, CapacityInput['method'], number[]][] = [
  ['B.52.2', 'pvc70', 2, 'A1', [14.5, 19.5, 26, 34, 46, 61, 80, 99]],
  ['B.52.2', 'pvc70', 2, 'A2', [14, 18.5, 25, 32, 43, 57, 75, 92]],
  ['B.52.2', 'pvc70', 2, 'B1', [17.5, 24, 32, 41, 57, 76, 101, 125]],
  ['B.52.2', 'pvc70', 2, 'B2', [16.5, 23, 30, 38, 52, 69, 90, 111]],
  ['B.52.2', 'pvc70', 2, 'C', [19.5, 27, 36, 46, 63, 85, 112, 138]],
  ['B.52.4', 'pvc70', 3, 'A1', [13.5, 18, 24, 31, 42, 56, 73, 89]],
  ['B.52.4', 'pvc70', 3, 'A2', [13, 17.5, 23, 29, 39, 52, 68, 83]],
  ['B.52.4', 'pvc70', 3, 'B1', [15.5, 21, 28, 36, 50, 68, 89, 110]],
  ['B.52.4', 'pvc70', 3, 'B2', [15, 20, 27, 34, 46, 62, 80, 99]],
  ['B.52.4', 'pvc70', 3, 'C', [17.5, 24, 32, 41, 57, 76, 96, 119]],
  ['B.52.3', 'xlpe90', 2, 'A1', [19, 26, 35, 45, 61, 81, 106, 131]],
  ['B.52.3', 'xlpe90', 2, 'B1', [23, 31, 42, 54, 75, 100, 133, 164]],
  ['B.52.3', 'xlpe90', 2, 'C', [24, 33, 45, 58, 80, 107, 138, 171]],
  ['B.52.5', 'xlpe90', 3, 'C', [22, 30, 40, 51, 70, 94, 119, 148]],
  ['B.52.10', 'pvc70', 2, 'E', [22, 30, 40, 51, 70, 94, 119, 148]],
  ['B.52.10', 'pvc70', 3, 'E', [18.5, 25, 34, 43, 60, 80, 101, 126]],
];

describe('current-carrying capacity It (IEC 60364-5-52 Annex B)', () => {
  for (const [table, insulation, loaded, method, values] of TABLES) {
    it(`Table ${table} ${insulation} ${loaded} loaded, method ${method}`, () => {
      // IEC 60364-5-52 Table named in the test title, copper, 30 °C air
      expect(sizes.map((live_mm2) => iz({ insulation, loaded, method, live_mm2 }).it_a)).toEqual(values);
    });
  }
});

describe('corrections applied as products (IEC 60364-5-52 Annex B)', () => {
  it('ambient air 40 °C PVC: Ca 0.87', () => {
    const c = iz({ ambient_c: 40 }); // Table B.52.14
    expect(c.ca).toBe(0.87);
    expect(c.iz_a).toBeCloseTo(27 * 0.87, 10);
  });
  it('ambient XLPE 50 °C: Ca 0.82', () => {
    expect(iz({ insulation: 'xlpe90', ambient_c: 50 }).ca).toBe(0.82); // Table B.52.14
  });
  it('takes the next higher tabulated temperature between steps', () => {
    expect(iz({ ambient_c: 37 }).ca).toBe(0.87); // Table B.52.14: 40 °C column for 37 °C (conservative)
  });
  it('grouping: 4 circuits bunched, Cg 0.65; 10 circuits take the 12-circuit factor 0.45', () => {
    expect(iz({ grouped: 4 }).cg).toBe(0.65); // Table B.52.17 row 1
    expect(iz({ grouped: 10 }).cg).toBe(0.45); // Table B.52.17 row 1, next column
  });
  it('thermal insulation: 100 mm of contact, Ci 0.78; over 0.5 m, 0.5', () => {
    expect(iz({ insulation_mm: 100 }).ci).toBe(0.78); // BS 7671 Table 52.2
    expect(iz({ insulation_mm: 600 }).ci).toBe(0.5); // BS 7671 523.9
  });
  it('multiplies all three', () => {
    const c = iz({ ambient_c: 35, grouped: 2, insulation_mm: 50 });
    expect(c.iz_a).toBeCloseTo(27 * 0.94 * 0.8 * 0.88, 10); // B.52.2 C 2.5 mm² × B.52.14 × B.52.17 × BS 7671 Table 52.2
    expect(c.basis).toContain('Iz = It 27 A × Ca 0.94 × Cg 0.8 × Ci 0.88 = 17.9 A');
  });
  it('method D defaults to the 20 °C ground reference', () => {
    expect(iz({ method: 'D' }).ca).toBe(1); // IEC 60364-5-52 B.52.15: reference ground temperature 20 °C
  });
});

describe('out-of-table inputs are problems, never guesses', () => {
  it.each([
    [{ live_mm2: 0.75 }, 'live_mm2'],
    [{ live_mm2: 300 }, 'live_mm2'],
    [{ method: 'F' as const }, 'method'],
    [{ material: 'al' as const, live_mm2: 16 }, 'conductor'],
    [{ ambient_c: 65 }, 'ambient_c'],
    [{ grouped: 21 }, 'grouped'],
  ])('%j', (over, field) => {
    const r = capacity({ ...base, ...over });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.field).toBe(field);
  });
});

describe('properties', () => {
  it('more grouping never raises Iz', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 19 }), fc.constantFrom(...sizes), (n, live_mm2) =>
      iz({ grouped: n + 1, live_mm2 }).iz_a <= iz({ grouped: n, live_mm2 }).iz_a));
  });
  it('a hotter room never raises Iz', () => {
    fc.assert(fc.property(fc.integer({ min: 10, max: 59 }), (t) => iz({ ambient_c: t + 1 }).iz_a <= iz({ ambient_c: t }).iz_a));
  });
});

// Sizes beyond 1.5–35 mm²: 1 mm² (common for lighting) and 50–240 mm² (sub-mains).
describe('current-carrying capacity beyond 1.5–35 mm²', () => {
  const large = [50, 70, 95, 120, 150, 185, 240];
  const CASES: [string, CapacityInput['insulation'], 2 | 3, CapacityInput['method'], number, number[]][] = [
    // [1 mm², 50…240 mm²]: 1 mm² from ABNT NBR 5410:2004 Table 36/37/38/39 (public reproductions);
    // 50–240 mm² from IEC 60364-5-52:2009 Table named, as publicly reproduced (two reproductions agree)
    ['B.52.2', 'pvc70', 2, 'C', 15, [168, 213, 258, 299, 344, 392, 461]],
    ['B.52.2', 'pvc70', 2, 'B1', 14, [151, 192, 232, 269, 300, 341, 400]],
    ['B.52.4', 'pvc70', 3, 'A1', 10, [108, 136, 164, 188, 216, 245, 286]],
    ['B.52.4', 'pvc70', 3, 'B2', 12, [118, 149, 179, 206, 225, 255, 297]],
    ['B.52.3', 'xlpe90', 2, 'C', 19, [209, 269, 328, 382, 441, 506, 599]],
    ['B.52.5', 'xlpe90', 3, 'B1', 16, [175, 222, 269, 312, 342, 384, 450]],
    // method D: the single buried method of NBR 5410:2004 Table 36 (IEC 60364-5-52:2001)
    ['B.52.2', 'pvc70', 2, 'D', 18, [148, 183, 216, 246, 278, 312, 361]],
  ];
  for (const [table, insulation, loaded, method, one, values] of CASES) {
    it(`Table ${table} ${insulation} ${loaded} loaded, method ${method}: 1 mm² and 50–240 mm²`, () => {
      expect(iz({ insulation, loaded, method, live_mm2: 1 }).it_a).toBe(one);
      expect(large.map((live_mm2) => iz({ insulation, loaded, method, live_mm2 }).it_a)).toEqual(values);
    });
  }
  it('capacity grows with size in every column held (a typo in the data would break it)', () => {
    for (const insulation of ['pvc70', 'xlpe90'] as const) {
      for (const loaded of [2, 3] as const) {
        for (const method of ['A1', 'A2', 'B1', 'B2', 'C', 'D', 'E'] as const) {
          const all = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, ...large].map((live_mm2) => iz({ insulation, loaded, method, live_mm2 }).it_a);
          for (let i = 1; i < all.length; i++) expect(all[i]!, `${insulation} ${loaded} ${method} #${i}`).toBeGreaterThan(all[i - 1]!);
        }
      }
    }
  });
  it('a size still not held is an input problem that names the sizes held', () => {
    const r = capacity({ ...base, live_mm2: 300 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/found 300 mm²; the capacity tables held cover 1, 1\.5, .* 240 mm²/);
  });
});
