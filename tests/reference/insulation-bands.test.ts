// Insulation resistance minimums and test voltages by circuit voltage band.
import { describe, expect, it } from 'vitest';
import { insulation } from '../../src/calc/checks/insulation.js';
import { context } from '../helpers/context.js';

const ir = (le: string, ll: string, v: string, supply: Record<string, unknown> = {}, circuit: Record<string, string> = {}) =>
  insulation(context(circuit, { ir_le_mohm: le, ir_ll_mohm: ll, ir_test_v: v }, supply));

describe('IEC 60364-6 Table 6A (Table 6.1): minimum insulation resistance and test voltage', () => {
  it('SELV and PELV: 250 V d.c., 0.5 MΩ', () => {
    const selv = { u0_v: '24' };
    expect(ir('0.49', '10', '250', selv).status).toBe('fail'); // IEC 60364-6 Table 6A: SELV/PELV 0.5 MΩ at 250 V
    expect(ir('0.5', '10', '250', selv)).toMatchObject({ status: 'attention', limit: 0.5 }); // below 2 MΩ: common practice
    expect(ir('5', '10', '250', selv).status).toBe('pass');
  });
  it('up to and including 500 V: 500 V d.c., 1.0 MΩ (a 230 V and a 400 V three-phase circuit)', () => {
    expect(ir('0.99', '>999', '500').status).toBe('fail'); // IEC 60364-6 Table 6A: ≤ 500 V, 1.0 MΩ at 500 V
    expect(ir('1.0', '>999', '500').status).toBe('attention');
    expect(ir('2', '>999', '500').status).toBe('pass');
    const three = ir('0.9', '>999', '500', {}, { phases: '3' }); // 230/400 V: 400 V between lines, still ≤ 500 V
    expect(three).toMatchObject({ status: 'fail', limit: 1 });
    expect(ir('>999', '>999', '100').status).toBe('fail'); // 100 V is too low for this band
    expect(ir('>999', '>999', '250').status).toBe('attention'); // BS 7671 643.3: 250 V allowed where SPDs stay connected
  });
  it('above 500 V: 1000 V d.c., 1.0 MΩ', () => {
    const hv = { u0_v: '400' }; // three-phase: 693 V between lines
    expect(ir('>999', '>999', '500', hv, { phases: '3' })).toMatchObject({ status: 'fail', value: 500, limit: 1000 }); // IEC 60364-6 Table 6A: > 500 V at 1000 V
    expect(ir('0.99', '50', '1000', hv, { phases: '3' }).status).toBe('fail');
    expect(ir('1.5', '50', '1000', hv, { phases: '3' }).status).toBe('attention');
    expect(ir('>999', '>999', '1000', hv, { phases: '3' }).status).toBe('pass');
  });
  it('passes an over-range reading (">999") whose bound passes, and reads the bound as a bound', () => {
    const r = ir('>999', '>999', '500');
    expect(r.status).toBe('pass');
    expect(r.basis).toMatch(/>999 MΩ/);
    expect(ir('>0.5', '>999', '500').status).toBe('not-verified'); // a bound below 1 MΩ proves nothing
  });
  it('fails a reading below the minimum even when the other is an inconclusive bound', () => {
    expect(ir('>0.5', '0.8', '500')).toMatchObject({ status: 'fail', value: 0.8 });
  });
  it('accepts L–L marked n/a only with a reason, judging L–E alone', () => {
    expect(ir('50', 'n/a', '500').status).toBe('not-verified');
    const r = insulation(context({}, { ir_le_mohm: '50', ir_ll_mohm: 'n/a', ir_test_v: '500', notes: 'dimmer left connected' }));
    expect(r.status).toBe('pass');
    expect(r.basis).toMatch(/L–E \(L–L n\/a\) 50 MΩ/);
  });
});
