import { describe, expect, it } from 'vitest';
import { kFor, kFormula } from '../../src/calc/design/k-factor.js';
import { PROTECTIVE_TEMPS } from '../../src/reference/protective-conductor.js';

describe('k of a protective conductor (IEC 60364-5-54 Annex A)', () => {
  it.each([
    // [material, where, insulation, tabulated k] — IEC 60364-5-54 Tables A.54.2 (separate) and A.54.3 (core)
    ['cu', 'core', 'pvc70', 115], ['cu', 'core', 'xlpe90', 143],
    ['cu', 'separate', 'pvc70', 143], ['cu', 'separate', 'xlpe90', 176],
    ['al', 'core', 'pvc70', 76], ['al', 'core', 'xlpe90', 94],
    ['al', 'separate', 'pvc70', 95], ['al', 'separate', 'xlpe90', 116],
  ] as const)('%s %s %s: the formula gives the tabulated %i within 1', (material, where, insulation, k) => {
    const t = PROTECTIVE_TEMPS[where][insulation];
    expect(Math.abs(kFormula(material, t.initial_c, t.final_c) - k)).toBeLessThanOrEqual(1);
    expect(kFor(material, insulation, where === 'core').k).toBe(k);
  });
});
