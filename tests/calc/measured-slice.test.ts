// The first slice of measured-result checks: insulation, polarity and measured Zs; the registry.
import { describe, expect, it } from 'vitest';
import { insulation } from '../../src/calc/checks/insulation.js';
import { polarity } from '../../src/calc/checks/polarity.js';
import { zsMeasured } from '../../src/calc/checks/zs-measured.js';
import { CHECKS } from '../../src/calc/checks/index.js';
import { context } from '../helpers/context.js';

describe('insulation resistance (IEC 60364-6 Table 6.1)', () => {
  const ir = (le: string, ll: string, v = '500') => insulation(context({}, { ir_le_mohm: le, ir_ll_mohm: ll, ir_test_v: v }));
  it('needs 1.0 MΩ at 500 V d.c. for a 230 V circuit', () => {
    expect(ir('0.99', '50').status).toBe('fail'); // IEC 60364-6 Table 6.1: ≤ 500 V → 1.0 MΩ
    expect(ir('1.0', '50').status).toBe('attention'); // meets 1.0 MΩ, below 2 MΩ: common practice
    expect(ir('2.0', '50').status).toBe('pass');
  });
  it('judges the lower of L–L and L–E', () => {
    expect(ir('>999', '0.8').status).toBe('fail');
    expect(ir('>999', '0.8').value).toBe(0.8);
  });
  it('passes an over-range reading whose bound passes', () => {
    expect(ir('>999', '>999').status).toBe('pass');
  });
  it('fails a test made at too low a voltage, saying why', () => {
    const r = ir('>999', '>999', '100');
    expect(r.status).toBe('fail');
    expect(r.basis).toMatch(/tested at 100 V.*500 V/);
  });
  it('needs 0.5 MΩ at 250 V for SELV/PELV', () => {
    const selv = insulation(context({}, { ir_le_mohm: '0.6', ir_ll_mohm: '0.6', ir_test_v: '250' }, { u0_v: '24' }));
    expect(selv.status).toBe('attention'); // IEC 60364-6 Table 6.1: SELV/PELV, 250 V, 0.5 MΩ
    expect(selv.limit).toBe(0.5);
  });
  it('is not verified when a reading or the test voltage is missing', () => {
    expect(insulation(context({}, { ir_le_mohm: '>999' })).status).toBe('not-verified');
    expect(insulation(context({}, { ir_le_mohm: '>999', ir_ll_mohm: '>999' })).status).toBe('not-verified');
    expect(insulation(context({}, { ir_le_mohm: 'not-tested', ir_ll_mohm: '>999', ir_test_v: '500' })).status).toBe('not-verified');
  });
});

describe('polarity', () => {
  it('passes ok, fails fail, and is not verified when missing or not tested', () => {
    expect(polarity(context({}, { polarity: 'ok' })).status).toBe('pass');
    expect(polarity(context({}, { polarity: 'fail' })).status).toBe('fail');
    expect(polarity(context({}, {})).status).toBe('not-verified');
    expect(polarity(context({}, { polarity: 'not-tested' })).status).toBe('not-verified');
    expect(polarity(context({}, { polarity: 'n/a' })).status).toBe('not-verified'); // n/a needs a reason
    expect(polarity(context({}, { polarity: 'n/a', notes: 'SELV circuit' })).status).toBe('n/a');
  });
});

describe('measured Zs against 0.8 × max Zs (common practice)', () => {
  // max Zs for B32 = 230 × 0.95 / 160 = 1.366 Ω (BS 7671:2018 Table 41.3: 1.37 Ω); 0.8 × = 1.093 Ω
  it('passes at the limit and fails just above it', () => {
    expect(zsMeasured(context({}, { zs_ohm: '1.09' })).status).toBe('pass');
    expect(zsMeasured(context({}, { zs_ohm: '1.10' })).status).toBe('fail');
    expect(zsMeasured(context({}, { zs_ohm: '1.09' })).limit).toBeCloseTo(1.093, 3);
  });
  it('shows the limit and the margin in its basis', () => {
    expect(zsMeasured(context({}, { zs_ohm: '0.74' })).basis).toMatch(/0\.74 Ω ≤ 0\.8 × max Zs 1\.37 Ω = 1\.09 Ω.*margin 0\.353 Ω/);
  });
  it('never passes without a reading or without a max Zs', () => {
    expect(zsMeasured(context({}, {})).status).toBe('not-verified');
    expect(zsMeasured(context({}, { zs_ohm: 'not-tested' })).status).toBe('not-verified');
    // BS 88-3 45 A: no published time-current points in the library, so no max Zs
    expect(zsMeasured(context({ device: 'fuse:bs88-3', rating_a: '45' }, { zs_ohm: '0.5' })).status).toBe('not-verified');
  });
});

describe('the check registry', () => {
  it('lists every check id of CONTRACT.md once', () => {
    expect(CHECKS.map(([id]) => id)).toEqual(['overload', 'voltage-drop', 'zs-design', 'disconnection', 'adiabatic',
      'cpc-size', 'breaking-capacity', 'continuity', 'ring', 'insulation', 'polarity', 'zs-measured', 'rcd', 'rcd-tt',
      'additional-protection', 'selectivity']);
  });
  it('passes no measured check of a circuit that has no readings', () => {
    const ctx = context({ ring: 'yes', rcd_ma: '30' }, {}, { ze_ohm: '0.3' });
    for (const [id, check] of CHECKS) {
      if (!['continuity', 'ring', 'insulation', 'polarity', 'zs-measured', 'rcd', 'rcd-tt'].includes(id)) continue;
      expect(['not-verified', 'n/a']).toContain(check(ctx).status);
    }
  });
});
