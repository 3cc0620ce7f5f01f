// Max Zs for circuit-breakers: U0 × Cmin / (k × In), k the upper instantaneous multiple.
import { describe, expect, it } from 'vitest';
import { maxZs } from '../../src/calc/devices/index.js';

const zs = (code: 'mcb:B' | 'mcb:C' | 'mcb:D' | 'rcbo:B', rating: number) =>
  maxZs({ code, rating_a: rating }, 0.4, 230, 0.95)!.max_zs_ohm;

describe('max Zs of circuit-breakers at 0.4 s, U0 230 V, Cmin 0.95', () => {
  it('B32 = 1.37 Ω', () => {
    expect(zs('mcb:B', 32)).toBeCloseTo(1.37, 2); // BS 7671:2018 Table 41.3, as quoted in REFERENCE.md
  });
  it.each([
    // BS 7671:2018 Table 41.3 (from memory): type B, C, D at 6, 16, 40 A
    ['mcb:B', 6, 7.28], ['mcb:B', 16, 2.73], ['mcb:B', 40, 1.09],
    ['mcb:C', 6, 3.64], ['mcb:C', 16, 1.37], ['mcb:C', 40, 0.55],
    ['mcb:D', 6, 1.82], ['mcb:D', 16, 0.68], ['mcb:D', 40, 0.27],
  ] as const)('%s %i A = %f Ω', (code, rating, published) => {
    expect(zs(code, rating)).toBeCloseTo(published, 2);
  });
  it('an RCBO has the same band as an MCB of its type', () => {
    expect(zs('rcbo:B', 32)).toBe(zs('mcb:B', 32)); // IEC 61009-1 uses the IEC 60898-1 B/C/D bands
  });
  it('follows the formula for any U0 and Cmin', () => {
    // U0 × Cmin / Ia, physical definition of the loop impedance that lets Ia flow
    expect(maxZs({ code: 'mcb:C', rating_a: 20 }, 0.4, 240, 1)!.max_zs_ohm).toBeCloseTo(240 / 200, 10);
  });
  it('answers null for a fuse until the device library has its curve', () => {
    expect(maxZs({ code: 'fuse:gG', rating_a: 20 }, 0.4, 230, 0.95)).toBeNull();
  });
});
