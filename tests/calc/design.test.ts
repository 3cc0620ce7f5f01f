import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { overload } from '../../src/calc/checks/overload.js';
import { voltageDropCheck } from '../../src/calc/checks/voltage-drop.js';
import { zsDesign } from '../../src/calc/checks/zs-design.js';
import { context } from '../helpers/context.js';

describe('overload: Ib ≤ In ≤ Iz', () => {
  // 4 mm² PVC two-core, method C: It = 36 A (IEC 60364-5-52 Table B.52.2)
  const on4mm2 = { live_mm2: '4', cpc_mm2: '1.5', ib_a: '20' };
  it('a 30 A semi-enclosed fuse on a cable of Iz 36 A fails: 30 > 0.725 × 36 = 26.1 A', () => {
    const r = overload(context({ ...on4mm2, device: 'fuse:bs3036', rating_a: '30' })); // BS 7671 433.1.202
    expect(r.status).toBe('fail');
    expect(r.limit).toBeCloseTo(26.1, 1);
  });
  it('a 32 A circuit-breaker on the same cable passes: 32 ≤ 36 A', () => {
    expect(overload(context({ ...on4mm2, device: 'mcb:B', rating_a: '32' })).status).toBe('pass'); // IEC 60364-4-43 433.1
  });
  it('fails when the design current exceeds the rating', () => {
    expect(overload(context({ ib_a: '25', rating_a: '20' })).status).toBe('fail');
  });
  it('fails when In exceeds Iz after grouping', () => {
    // 2.5 mm² C: 27 A × Cg 0.7 (3 circuits, Table B.52.17) = 18.9 A < 20 A
    const r = overload(context({ ib_a: '16', rating_a: '20', grouped: '3' }));
    expect(r.status).toBe('fail');
    expect(r.basis).toContain('Iz = It 27 A × Cg 0.7 = 18.9 A');
  });
  it('accepts a 32 A ring on 2.5 mm² (Iz 27 A ≥ 0.67 × 32 A)', () => {
    expect(overload(context({ ring: 'yes', rating_a: '32', ib_a: '26' })).status).toBe('pass'); // BS 7671 433.1.204, common practice
  });
  it('is not verified for an out-of-table cable', () => {
    expect(overload(context({ live_mm2: '300', cpc_mm2: '150' })).status).toBe('not-verified');
  });
});

describe('voltage drop (IEC 60364-5-52 Annex G)', () => {
  it('single-phase: 2 × L × r(70 °C) × Ib', () => {
    // 2.5 mm²: r70 = 7.41 × 1.1965 = 8.866 mΩ/m (IEC 60228, IEC 60287-1-1); 2 × 20 × 8.866 × 20 A = 7.09 V = 3.08 % of 230 V
    const r = voltageDropCheck(context({ length_m: '20', ib_a: '20' }));
    expect(r.value).toBeCloseTo((2 * 20 * 7.41 * 1.1965 * 20) / 1000 / 230 * 100, 2);
    expect(r.status).toBe('pass');
  });
  it('applies the lighting limit of 3 %', () => {
    const r = voltageDropCheck(context({ kind: 'lighting', length_m: '20', ib_a: '20' }));
    expect(r.limit).toBe(3); // IEC 60364-5-52 Table G.52.1
    expect(r.status).toBe('fail');
  });
  it('three-phase: √3 × L × r × Ib as % of the line voltage', () => {
    const r = voltageDropCheck(context({ phases: '3', length_m: '50', ib_a: '20' }));
    const volts = (Math.sqrt(3) * 50 * 7.41 * 1.1965 * 20) / 1000;
    expect(r.value).toBeCloseTo((100 * volts) / (Math.sqrt(3) * 230), 2);
  });
  it('a ring takes its load at the midpoint: a quarter of the ring length', () => {
    const ring = voltageDropCheck(context({ ring: 'yes', length_m: '80', ib_a: '20' }));
    const radial = voltageDropCheck(context({ length_m: '20', ib_a: '20' }));
    expect(ring.value).toBeCloseTo(radial.value!, 10);
  });
  it('adds the Annex G reactance of 0.08 mΩ/m from 25 mm²', () => {
    const r = voltageDropCheck(context({ live_mm2: '25', cpc_mm2: '16', length_m: '100', ib_a: '80', rating_a: '100' }));
    const z = Math.hypot(0.727 * 1.1965, 0.08); // IEC 60364-5-52 G.52.2
    expect(r.value).toBeCloseTo(((2 * 100 * z * 80) / 1000 / 230) * 100, 2);
  });
});

describe('design Zs', () => {
  it('Ze + R1+R2 at 70 °C against max Zs', () => {
    // R1+R2 of 2.5/1.5 mm² at 20 °C: 7.41 + 12.1 = 19.51 mΩ/m (IEC 60228); × 1.1965 at 70 °C
    const r = zsDesign(context({ length_m: '30' }, {}, { ze_ohm: '0.35' }));
    expect(r.value).toBeCloseTo(0.35 + (30 * 19.51 * 1.1965) / 1000, 3);
    expect(r.limit).toBeCloseTo(1.366, 3); // B32: 230 × 0.95 / 160 (BS 7671:2018 Table 41.3: 1.37)
    expect(r.status).toBe('pass');
  });
  it('fails a long circuit', () => {
    expect(zsDesign(context({ length_m: '60' }, {}, { ze_ohm: '0.35' })).status).toBe('fail');
  });
  it('a ring: (r1 + r2)/4', () => {
    const ring = zsDesign(context({ length_m: '80', ring: 'yes' }, {}, { ze_ohm: '0.35' }));
    const radial = zsDesign(context({ length_m: '20' }, {}, { ze_ohm: '0.35' }));
    expect(ring.value).toBeCloseTo(radial.value!, 10);
  });
  it('is not verified without Ze or Zdb', () => {
    expect(zsDesign(context({}, {}, {})).status).toBe('not-verified');
  });
});

describe('properties', () => {
  it('a longer cable never lowers voltage drop or design Zs', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 200 }), fc.integer({ min: 1, max: 50 }), fc.boolean(), (l, extra, ring) => {
      const a = context({ length_m: String(l), ring: ring ? 'yes' : 'no' }, {}, { ze_ohm: '0.3' });
      const b = context({ length_m: String(l + extra), ring: ring ? 'yes' : 'no' }, {}, { ze_ohm: '0.3' });
      return b.design.vd!.percent >= a.design.vd!.percent && b.design.zs!.ohm >= a.design.zs!.ohm;
    }));
  });
});
