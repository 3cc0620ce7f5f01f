// Point 9: readings taken cold are compared with limits corrected for the conductors' temperature in
// service, never with the hot limit; implausible readings are queried.
import { describe, expect, it } from 'vitest';
import { continuity } from '../../src/calc/checks/continuity.js';
import { zsMeasured } from '../../src/calc/checks/zs-measured.js';
import { zsDesign } from '../../src/calc/checks/zs-design.js';
import { context } from '../helpers/context.js';

const ze = { ze_ohm: '0.28', pfc_ka: '1.5' };

describe('continuity: cold R1+R2 raised to the operating temperature', () => {
  it('B32: 0.28 + 1.0 Ω read cold is 0.28 + 1.0 × 1.1965 = 1.48 Ω hot > max Zs 1.366 Ω: fail (before: 1.28 ≤ 1.366 passed)', () => {
    // R(70 °C)/R(20 °C) = 1 + 0.00393 × 50 (IEC 60287-1-1, copper, PVC 70 °C); max Zs 230 × 0.95 / 160 (IEC 60898-1)
    const r = continuity(context({}, { r1r2_ohm: '1.0' }, ze, 0.4, { derived: { r1r2_expected_ohm: 0.9 } }));
    expect(r.status).toBe('fail');
    expect(r.basis).toMatch(/× 1\.2.*resistance ratio 70 °C \/ 20 °C/);
    expect(r.limit).toBeCloseTo((1.366 - 0.28) / 1.1965, 2);
  });
  it('XLPE at 90 °C takes the larger ratio 1 + 0.00393 × 70 = 1.275', () => {
    const r = continuity(context({ insulation: 'xlpe90' }, { r1r2_ohm: '0.5' }, ze, 0.4, { derived: { r1r2_expected_ohm: 0.45 } }));
    expect(r.basis).toContain('× 1.28');
  });
});

describe('measured Zs: the factor corrects the cold reading (common practice), and the basis says so', () => {
  it('names the correction', () => {
    const r = zsMeasured(context({}, { zs_ohm: '0.8' }, ze));
    expect(r.status).toBe('pass');
    expect(r.basis).toMatch(/0\.8 × max Zs.*temperature in service/);
  });
  it('queries a measured Zs below the measured R1+R2 or below Ze: part of the same loop', () => {
    expect(zsMeasured(context({}, { zs_ohm: '0.5', r1r2_ohm: '0.6' }, ze)).status).toBe('attention');
    expect(zsMeasured(context({}, { zs_ohm: '0.2' }, ze)).status).toBe('attention');
  });
  it('queries a Zdb below Ze in the design Zs', () => {
    const r = zsDesign(context({}, {}, ze, 0.4, { board: { zdb_ohm: '0.2' } }));
    expect(r.status).toBe('attention');
    expect(r.basis).toMatch(/below Ze/);
  });
});
