// Additional protection by a 30 mA RCD (point 2): IEC 60364-4-41 411.3.3; BS 7671 411.3.3, 411.3.4,
// 522.6.202/203. Before this check a socket-outlet circuit without an RCD passed every check.
import { describe, expect, it } from 'vitest';
import { additionalProtection } from '../../src/calc/checks/additional-protection.js';
import { context } from '../helpers/context.js';

const tn = { ze_ohm: '0.35', pfc_ka: '1.5' };
const ap = (c: Record<string, string>, set = 'iec-60364', premises: 'dwelling' | 'other' = 'dwelling') =>
  additionalProtection(context(c, {}, tn, undefined, { rules: { set }, premises }));

describe('additional protection (411.3.3)', () => {
  it('fails a 32 A socket circuit without a 30 mA RCD (411.3.3)', () => {
    const r = ap({ kind: 'power' });
    expect(r.status).toBe('fail');
    expect(r.basis).toMatch(/411\.3\.3/);
  });
  it('passes it with a 30 mA type A RCD, naming the rule', () => {
    const r = ap({ kind: 'power', device: 'rcbo:B', rcd_ma: '30', rcd_type: 'A' });
    expect(r.status).toBe('pass');
    expect(r.basis).toMatch(/411\.3\.3/);
  });
  it('a time-delayed RCD, or one above 30 mA, does not give it', () => {
    expect(ap({ kind: 'power', rcd_ma: '30', rcd_type: 'A-S' }).status).toBe('fail');
    expect(ap({ kind: 'power', rcd_ma: '100', rcd_type: 'A' }).status).toBe('fail');
  });
  it('an RCD of unrecorded type cannot be shown not to be time-delayed: attention', () => {
    expect(ap({ kind: 'power', rcd_ma: '30' }).status).toBe('attention');
  });
  it('is n/a for fixed equipment', () => {
    expect(ap({ kind: 'heating' }).status).toBe('n/a');
  });
  it('on a circuit above 32 A with socket-outlets, whose own rating is not recorded: attention without the RCD, never n/a (before: n/a)', () => {
    // 411.3.3 is on the socket-outlet's rated current, not the circuit's: a 40 A cooker circuit may
    // carry a 13 A socket-outlet on its control unit (BS 1363, 13 A)
    const cooker = { kind: 'heating', sockets: 'yes', rating_a: '40', live_mm2: '10', cpc_mm2: '4', ib_a: '30' };
    const r = ap(cooker);
    expect(r.status).toBe('attention');
    expect(r.basis).toMatch(/411\.3\.3.*/);
    expect(r.basis).toMatch(/rating is not recorded/);
    expect(ap({ ...cooker, rcd_ma: '30', rcd_type: 'A' }).status).toBe('pass');
    expect(ap({ kind: 'power', rating_a: '40', live_mm2: '10', cpc_mm2: '4' }).status).toBe('attention');
    // a rule that certainly applies beside it still fails: a concealed cable (BS 7671 522.6.202)
    expect(ap({ kind: 'power', rating_a: '40', live_mm2: '10', cpc_mm2: '4', concealed: 'yes' }, 'bs-7671').status).toBe('fail');
  });
  it('mobile equipment used outdoors up to 32 A needs it; on a larger circuit, whose equipment\'s rating is not recorded, attention', () => {
    expect(ap({ kind: 'motor', outdoors: 'yes', rating_a: '16' }).status).toBe('fail');
    expect(ap({ kind: 'motor', outdoors: 'yes', rating_a: '40', live_mm2: '10', cpc_mm2: '4' }).status).toBe('attention');
  });
  it('an exemption is attention with its text outside dwellings, refused in a dwelling', () => {
    const other = ap({ kind: 'power', rcd_exemption: 'risk assessment RA-3' }, 'bs-7671', 'other');
    expect(other.status).toBe('attention');
    expect(other.basis).toContain('risk assessment RA-3');
    expect(ap({ kind: 'power', rcd_exemption: 'risk assessment RA-3' }, 'bs-7671', 'dwelling').status).toBe('fail');
  });
  it('BS 7671: luminaires in dwellings (411.3.4) and concealed cables (522.6.202/203); not under IEC 60364', () => {
    const light = { kind: 'lighting', rating_a: '6', live_mm2: '1.5', cpc_mm2: '1.0', ib_a: '3' };
    expect(ap(light, 'bs-7671', 'dwelling')).toMatchObject({ status: 'fail' });
    expect(ap(light, 'bs-7671', 'dwelling').basis).toMatch(/411\.3\.4/);
    expect(ap(light, 'bs-7671', 'other').status).toBe('n/a');
    expect(ap(light, 'iec-60364', 'dwelling').status).toBe('n/a');
    const buried = ap({ kind: 'heating', concealed: 'yes' }, 'bs-7671', 'other');
    expect(buried.status).toBe('fail');
    expect(buried.basis).toMatch(/522\.6\.202/);
    // an exemption does not cover a concealed cable
    expect(ap({ kind: 'heating', concealed: 'yes', rcd_exemption: 'RA' }, 'bs-7671', 'other').status).toBe('fail');
  });
});
