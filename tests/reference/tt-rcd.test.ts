// TT supplies with an RCD: RA × IΔn ≤ 50 V, and loop impedances judged by the RCD's condition.
import { describe, expect, it } from 'vitest';
import { rcdTt } from '../../src/calc/checks/rcd-tt.js';
import { zsMeasured } from '../../src/calc/checks/zs-measured.js';
import { faultProtection } from '../../src/calc/fault-protection.js';
import { context } from '../helpers/context.js';

const TT = { earthing: 'TT', ra_ohm: '45' };
const withRcd = (ma = '30') => ({ device: 'rcbo:B', rating_a: '20', rcd_ma: ma, rcd_type: 'A' });

describe('RA × IΔn ≤ 50 V (IEC 60364-4-41, 411.5.3)', () => {
  it('passes 45 Ω with a 30 mA RCD: 1.35 V', () => {
    const r = rcdTt(context(withRcd(), {}, TT));
    expect(r.status).toBe('pass');
    expect(r.value).toBeCloseTo(1.35, 6); // 45 Ω × 0.030 A
    expect(r.limit).toBe(50);
    expect(r.basis).toMatch(/RA 45 Ω × IΔn 30 mA = 1\.35 V ≤ 50 V/);
  });
  it('meets the limit exactly at RA = 50 V / IΔn and fails above it', () => {
    // 50 V / 0.3 A = 166.7 Ω; 50 V / 0.1 A = 500 Ω (IEC 60364-4-41, 411.5.3)
    expect(rcdTt(context(withRcd('100'), {}, { earthing: 'TT', ra_ohm: '500' })).status).toBe('attention'); // meets it; above 200 Ω queried
    expect(rcdTt(context(withRcd('100'), {}, { earthing: 'TT', ra_ohm: '501' })).status).toBe('fail');
    expect(rcdTt(context(withRcd('300'), {}, { earthing: 'TT', ra_ohm: '166' })).status).toBe('pass');
    expect(rcdTt(context(withRcd('300'), {}, { earthing: 'TT', ra_ohm: '167' })).status).toBe('fail');
  });
  it('queries an electrode above 200 Ω that meets the condition (common practice; from memory)', () => {
    expect(rcdTt(context(withRcd(), {}, { earthing: 'TT', ra_ohm: '210' })).status).toBe('attention');
    expect(rcdTt(context(withRcd(), {}, { earthing: 'TT', ra_ohm: '200' })).status).toBe('pass');
  });
  it('is not verified without RA, and n/a off TT or without an RCD', () => {
    expect(rcdTt(context(withRcd(), {}, { earthing: 'TT' })).status).toBe('not-verified');
    expect(rcdTt(context(withRcd(), {}, { earthing: 'TN-S' })).status).toBe('n/a');
    expect(rcdTt(context({}, {}, TT)).status).toBe('n/a');
  });
});

describe('fault protection: RCD on TT, overcurrent device otherwise', () => {
  it('takes Zs × IΔn ≤ 50 V for an RCD on a TT supply: 1667 Ω at 30 mA', () => {
    const fp = faultProtection(context(withRcd(), {}, TT));
    expect(fp.by).toBe('rcd');
    expect(fp.limit_ohm).toBeCloseTo(1666.67, 2); // 50 V / 0.03 A (IEC 60364-4-41, 411.5.3)
  });
  it('takes max Zs of the overcurrent device on TN, and on TT without an RCD', () => {
    const tn = faultProtection(context(withRcd(), {}, { earthing: 'TN-S' }));
    expect(tn.by).toBe('overcurrent');
    expect(tn.limit_ohm).toBeCloseTo(230 * 0.95 / 100, 6); // B20: U0 × Cmin / (5 × 20 A), IEC 60898-1
    expect(faultProtection(context({}, {}, TT)).by).toBe('overcurrent');
  });
  it('judges measured Zs on TT with an RCD by the RCD condition and says so', () => {
    const r = zsMeasured(context(withRcd(), { zs_ohm: '52' }, TT));
    expect(r.status).toBe('pass'); // 52 Ω ≫ max Zs 2.19 Ω of a B20, but 52 × 0.03 = 1.56 V ≤ 50 V
    expect(r.basis).toMatch(/fault protection by the 30 mA RCD: Zs × IΔn ≤ 50 V/);
    expect(r.limit).toBeCloseTo(1666.667, 3);
    expect(zsMeasured(context(withRcd(), { zs_ohm: '1700' }, TT)).status).toBe('fail');
  });
  it('judges measured Zs on TT without an RCD by the overcurrent device', () => {
    const r = zsMeasured(context({}, { zs_ohm: '52' }, TT));
    expect(r.status).toBe('fail');
    expect(r.basis).toMatch(/fault protection by the overcurrent device/);
  });
});
