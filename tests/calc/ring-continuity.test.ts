// Ring final circuit tests and continuity of protective conductors (R1+R2).
import { describe, expect, it } from 'vitest';
import { ring } from '../../src/calc/checks/ring.js';
import { continuity } from '../../src/calc/checks/continuity.js';
import { context } from '../helpers/context.js';

const RING = { ring: 'yes', live_mm2: '2.5', cpc_mm2: '1.5' };
const ends = (r1: string, rn: string, r2: string, cross: string, circuit: Record<string, string> = RING) =>
  ring(context(circuit, { ring_r1_ohm: r1, ring_rn_ohm: rn, ring_r2_ohm: r2, r1r2_ohm: cross }));

describe('ring final circuits (common practice)', () => {
  it('passes a sound 2.5/1.5 mm² ring: r2 ≈ 1.67 × r1, R1+R2 ≈ (r1 + r2)/4', () => {
    const r = ends('0.34', '0.34', '0.56', '0.23');
    expect(r.status).toBe('pass'); // common practice: 0.34 × 2.5/1.5 = 0.567; (0.34 + 0.56)/4 = 0.225
    expect(r.basis).toMatch(/r1 × 2\.5\/1\.5 mm² = 0\.567 Ω/);
    expect(r.basis).toMatch(/\(r1 \+ r2\)\/4 = 0\.225 Ω/);
  });
  it('needs r1 and rn within 0.05 Ω', () => {
    expect(ends('0.34', '0.39', '0.56', '0.23').status).toBe('pass'); // common practice: 0.05 Ω apart is within
    const r = ends('0.34', '0.40', '0.56', '0.23');
    expect(r.status).toBe('fail');
    expect(r.basis).toMatch(/off by 0\.06 Ω/);
    expect(r).toMatchObject({ value: 0.06, limit: 0.05 });
  });
  it('needs r2 within 0.05 Ω of r1 × live csa / cpc csa', () => {
    expect(ends('0.34', '0.34', '0.61', '0.24').status).toBe('pass'); // 0.61 − 0.567 = 0.043
    expect(ends('0.34', '0.34', '0.62', '0.24').status).toBe('fail'); // 0.62 − 0.567 = 0.053: common practice
    // a 4/1.5 mm² ring: ratio 2.67
    expect(ring(context({ ring: 'yes', live_mm2: '4', cpc_mm2: '1.5' }, { ring_r1_ohm: '0.30', ring_rn_ohm: '0.30', ring_r2_ohm: '0.80', r1r2_ohm: '0.28' })).status).toBe('pass');
  });
  it('queries a cross-connected R1+R2 off (r1 + r2)/4 by more than 0.05 Ω', () => {
    expect(ends('0.34', '0.34', '0.56', '0.27').status).toBe('pass');
    const spur = ends('0.34', '0.34', '0.56', '0.30');
    expect(spur.status).toBe('attention'); // higher at a spur (common practice)
    expect(spur.basis).toMatch(/a spur/);
  });
  it('fails an open ring (over-range end-to-end reading)', () => {
    expect(ends('>20', '0.34', '0.56', '0.23').status).toBe('fail');
  });
  it('is not verified when an end-to-end or the cross-connected reading is missing', () => {
    expect(ring(context(RING, { ring_r1_ohm: '0.34', ring_rn_ohm: '0.34', r1r2_ohm: '0.23' })).status).toBe('not-verified');
    expect(ring(context(RING, { ring_r1_ohm: '0.34', ring_rn_ohm: '0.34', ring_r2_ohm: '0.56' })).status).toBe('not-verified');
    expect(ends('0.34', 'not-tested', '0.56', '0.23').status).toBe('not-verified');
  });
  it('is n/a on a radial circuit', () => {
    expect(ring(context({}, { ring_r1_ohm: '0.34' }))).toMatchObject({ status: 'n/a', basis: 'not a ring final circuit' });
  });
});

describe('continuity: measured R1+R2 against the cable', () => {
  const ze = { ze_ohm: '0.28' };
  const expect20 = (ohm: number | null) => ({ derived: { r1r2_expected_ohm: ohm } });
  const cont = (r1r2: string, expected: number | null = 0.40) =>
    continuity(context({}, { r1r2_ohm: r1r2 }, ze, 0.4, expect20(expected)));

  it('passes up to expected + 25 % + 0.05 Ω and queries above (common practice)', () => {
    // 0.40 × 1.25 + 0.05 = 0.55 Ω at 20 °C
    expect(cont('0.55')).toMatchObject({ status: 'pass', limit: 0.55 });
    expect(cont('0.56').status).toBe('attention');
  });
  it('compares at 20 °C and says so', () => {
    expect(cont('0.50').basis).toMatch(/measured R1\+R2 0\.5 Ω ≤ 0\.55 Ω \(expected 0\.4 Ω at 20 °C \+ 25 % \+ 0\.05 Ω; common practice\)/);
  });
  it('takes a tolerance from the rule set', () => {
    const strict = continuity(context({}, { r1r2_ohm: '0.50' }, ze, 0.4, { ...expect20(0.40), rules: { r1r2_tolerance_percent: 10 } }));
    expect(strict.status).toBe('attention'); // 0.40 × 1.10 + 0.05 = 0.49 Ω
  });
  it('fails when Ze + R1+R2 exceeds max Zs, even before the expected value is known', () => {
    // B32: max Zs 230 × 0.95 / 160 = 1.366 Ω (IEC 60898-1 band, BS 7671 Table 41.3: 1.37 Ω). The cold
    // reading is raised to 70 °C by 1 + 0.00393 × 50 = 1.1965 (IEC 60287-1-1) before the comparison
    expect(cont('1.09', null).status).toBe('fail'); // 0.28 + 1.09 × 1.1965 = 1.58 Ω > 1.366 Ω
    expect(cont('0.91', null).status).toBe('fail'); // 0.28 + 0.91 × 1.1965 = 1.369 Ω > 1.366 Ω
    expect(cont('0.90', 0.8).status).toBe('pass'); // 0.28 + 0.90 × 1.1965 = 1.357 Ω ≤ 1.366 Ω, within the cable's tolerance
    const sub = continuity(context({}, { r1r2_ohm: '0.87' }, ze, 0.4, { ...expect20(0.7), board: { zdb_ohm: '0.5' } }));
    expect(sub.status).toBe('fail'); // the board's Zdb is used: 0.5 + 0.87 × 1.1965 = 1.54 Ω
    expect(sub.basis).toMatch(/Zdb 0\.5 Ω at DB1/);
  });
  it('is not verified when the expected R1+R2, Ze or the reading is missing', () => {
    expect(cont('0.40', null).status).toBe('not-verified');
    expect(continuity(context({}, { r1r2_ohm: '0.40' }, {}, 0.4, expect20(0.40))).status).toBe('not-verified');
    expect(continuity(context({}, {}, ze, 0.4, expect20(0.40))).status).toBe('not-verified');
    expect(cont('not-tested').status).toBe('not-verified');
  });
});
