// Disconnection, adiabatic and breaking capacity from the design earth fault.
import { describe, expect, it } from 'vitest';
import { adiabatic } from '../../src/calc/checks/adiabatic.js';
import { breakingCapacity } from '../../src/calc/checks/breaking-capacity.js';
import { disconnection } from '../../src/calc/checks/disconnection.js';
import { zsDesign } from '../../src/calc/checks/zs-design.js';
import { context } from '../helpers/context.js';

// B32 on 2.5/1.5 mm², 20 m, Ze 0.35 Ω: R1+R2 = 20 × 19.51 × 1.1965 / 1000 = 0.467 Ω (IEC 60228, 70 °C)
const ze = { ze_ohm: '0.35', pfc_ka: '1.5' };
const zs = 0.35 + (20 * 19.51 * 1.1965) / 1000;

describe('disconnection (IEC 60364-4-41 Table 41.1)', () => {
  it('B32 at If = 230 × 0.95 / Zs ≥ 160 A opens within 0.1 s ≤ 0.4 s', () => {
    const r = disconnection(context({}, {}, ze));
    expect(r.status).toBe('pass');
    expect(r.value).toBe(0.1); // IEC 60898-1: within 0.1 s at 5 In
    expect(r.basis).toContain(`If = U0 230 V × Cmin 0.95 / design Zs ${Number(zs.toPrecision(3))} Ω`);
  });
  it('fails when If falls into the thermal region: B32 at 100 m', () => {
    // Zs = 0.35 + 100 × 19.51 × 1.1965 / 1000 = 2.68 Ω → 81.5 A < 160 A: only "within 60 s" is promised below 5 In
    // and 81.5 A < 2.55 In = 81.6 A: within 1 h (IEC 60898-1 Table 7)
    const r = disconnection(context({ length_m: '100' }, {}, ze));
    expect(r.status).toBe('fail');
    expect(r.value).toBeGreaterThan(0.4);
  });
  it('a fixed-equipment circuit above 32 A has 5 s (TN); one with socket-outlets keeps 0.4 s up to 63 A', () => {
    // IEC 60364-4-41 411.3.2.2 / 411.3.2.3: Table 41.1 up to 32 A fixed equipment, 63 A with socket-outlets
    const fixed = context({ rating_a: '40', ib_a: '30', live_mm2: '10', cpc_mm2: '4', kind: 'heating' }, {}, ze);
    expect(fixed.derived.required_disconnect_s).toBe(5);
    const sockets = context({ rating_a: '40', ib_a: '30', live_mm2: '10', cpc_mm2: '4', kind: 'power' }, {}, ze);
    expect(sockets.derived.required_disconnect_s).toBe(0.4);
  });
  it('on TT with an RCD the RCD opens: 40 ms at 5 × IΔn (IEC 61008-1)', () => {
    const r = disconnection(context({ rcd_ma: '30', device: 'rcbo:B' }, {}, { earthing: 'TT', ze_ohm: '21', ra_ohm: '20' }));
    expect(r.status).toBe('pass');
    expect(r.value).toBe(0.04);
    expect(r.limit).toBe(0.2); // IEC 60364-4-41 Table 41.1: TT, 120–230 V
  });
  it('on TT without an RCD the overcurrent device must open in 0.2 s, and cannot with a high RA', () => {
    const r = disconnection(context({}, {}, { earthing: 'TT', ze_ohm: '21' }));
    expect(r.status).toBe('fail'); // 230 × 0.95 / 21.5 Ω = 10 A: a B32 does not operate
  });
  it('is not verified for a device without a characteristic, or without Ze/Zdb', () => {
    expect(disconnection(context({}, {}, {})).status).toBe('not-verified');
    expect(disconnection(context({ device: 'fuse:gG', rating_a: '2' }, {}, ze)).status).toBe('not-verified');
  });
});

describe('zs-design on TT with an RCD: 50 V / IΔn (IEC 60364-4-41 411.5.3)', () => {
  it('judges Zs against 50 V / 30 mA = 1667 Ω, not the breaker max Zs', () => {
    const r = zsDesign(context({ rcd_ma: '30', device: 'rcbo:B' }, {}, { earthing: 'TT', ze_ohm: '21' }));
    expect(r.status).toBe('pass');
    expect(r.limit).toBeCloseTo(50 / 0.03, 2);
  });
});

describe('adiabatic: S = √(I²t) / k (IEC 60364-5-54 543.1.2)', () => {
  it('a B32 at 0.1 s with k 115: √(If² × 0.1) / 115 mm² at the minimum fault current', () => {
    // the maker's let-through at the board's fault level covers the maximum fault current
    const r = adiabatic(context({ let_through_a2s: '20000' }, {}, ze));
    const If = (230 * 0.95) / zs;
    // k 115: IEC 60364-5-54 Table A.54.3, PVC core; I² × 0.1 s bounds the energy within the instantaneous region (IEC 60898-1)
    expect(r.basis).toContain(`I²t ≤ ${Number(If.toPrecision(3))}² × 0.1 s`);
    // the limit is the larger need: the maker's 20 000 A²s at the maximum fault current
    expect(r.limit).toBeCloseTo(Math.sqrt(20000) / 115, 3);
    expect(r.status).toBe('pass');
  });
  it('a separate cpc takes k 143', () => {
    const r = adiabatic(context({ cpc_in_cable: 'no' }, {}, ze));
    expect(r.basis).toContain('k 143'); // IEC 60364-5-54 Table A.54.2, PVC, separate
  });
  it('fails where the device takes longer than 5 s', () => {
    expect(adiabatic(context({ length_m: '100' }, {}, ze)).status).toBe('fail');
  });
  it('worked example: 3000 A for 0.4 s on a PVC cpc core (k 115) needs 16.5 mm²', () => {
    // calcdomain.com, "Adiabatic equation" worked example: S = 3000 × √0.4 / 115 ≈ 16.5 mm²
    expect(Math.sqrt(3000 ** 2 * 0.4) / 115).toBeCloseTo(16.5, 1);
  });
});

describe('breaking capacity (IEC 60364-4-43 434.5.1)', () => {
  it('passes a 6 kA breaker at 1.5 kA, and fails one at 10 kA', () => {
    expect(breakingCapacity(context({ breaking_ka: '6' }, {}, ze)).status).toBe('pass');
    expect(breakingCapacity(context({ breaking_ka: '6' }, {}, { ...ze, pfc_ka: '10' })).status).toBe('fail'); // IEC 60898-1 Icn 6 kA
  });
  it('uses the board prospective fault current before the origin', () => {
    const r = breakingCapacity(context({ breaking_ka: '10' }, {}, { ...ze, pfc_ka: '12' }, undefined, { board: { pfc_ka: '8' } }));
    expect(r.status).toBe('pass');
    expect(r.value).toBe(8);
  });
  it('a semi-enclosed fuse of category S1A breaks 1 kA', () => {
    expect(breakingCapacity(context({ device: 'fuse:bs3036', rating_a: '30', breaking_ka: '1' }, {}, ze)).status).toBe('fail'); // BS 3036 S1A = 1 kA
  });
  it('is not verified without any prospective fault current', () => {
    expect(breakingCapacity(context({}, {}, { ze_ohm: '0.35' })).status).toBe('not-verified');
  });
});
