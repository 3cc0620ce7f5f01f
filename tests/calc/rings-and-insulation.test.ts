// Point 12: ring final circuits per BS 7671 433.1.204 (30/32 A device, copper live conductors
// ≥ 2.5 mm², Iz ≥ 20 A); point 13: insulation tested at 250 V (BS 7671 643.3; IEC 60364-6 6.4.3.3).
import { describe, expect, it } from 'vitest';
import { overload } from '../../src/calc/checks/overload.js';
import { insulation } from '../../src/calc/checks/insulation.js';
import { context } from '../helpers/context.js';

describe('rings (BS 7671 433.1.204)', () => {
  it('a BS 3036 30 A ring on 2.5 mm² passes with Iz ≥ 20 A (before: failed In ≤ 0.725 Iz)', () => {
    // Iz 27 A: IEC 60364-5-52 Table B.52.2, method C, 2.5 mm² PVC
    const r = overload(context({ ring: 'yes', device: 'fuse:bs3036', rating_a: '30' }));
    expect(r.status).toBe('pass');
    expect(r.basis).toMatch(/433\.1\.204/);
    expect(r.basis).not.toMatch(/0\.67/);
  });
  it('a B32 ring on 1.5 mm² fails: outside 433.1.204 it is judged as any circuit, In 32 A > Iz', () => {
    expect(overload(context({ ring: 'yes', live_mm2: '1.5', cpc_mm2: '1.0' })).status).toBe('fail');
    // XLPE: Iz 24 A (IEC 60364-5-52 Table B.52.3, method C, 2 loaded) ≥ the old "0.67 × In" = 21.4 A,
    // which passed it before; In 32 A > Iz 24 A (IEC 60364-4-43, 433.1)
    const xlpe = overload(context({ ring: 'yes', live_mm2: '1.5', cpc_mm2: '1.0', insulation: 'xlpe90', ib_a: '12' }));
    expect(xlpe).toMatchObject({ status: 'fail', limit: 24 });
    expect(xlpe.basis).toMatch(/433\.1\)/);
  });
  it('a ring whose cable has Iz below 20 A fails (grouped: 27 × 0.7 = 18.9 A, Table B.52.17)', () => {
    expect(overload(context({ ring: 'yes', grouped: '3' })).status).toBe('fail');
  });
  it('a ring on a 20 A device is judged as a radial circuit', () => {
    const r = overload(context({ ring: 'yes', rating_a: '20', ib_a: '13' }));
    expect(r.status).toBe('pass');
    expect(r.basis).toMatch(/433\.1\b/);
  });
});

describe('insulation at 250 V on a 230 V circuit (BS 7671 643.3)', () => {
  const ir = (le: string, v: string) => insulation(context({}, { ir_le_mohm: le, ir_ll_mohm: '>999', ir_test_v: v }));
  it('is attention, not fail, with the 1 MΩ minimum (before: fail)', () => {
    const r = ir('>999', '250');
    expect(r.status).toBe('attention');
    expect(r.limit).toBe(1);
    expect(r.basis).toMatch(/643\.3/);
  });
  it('below 1 MΩ at 250 V fails; below 250 V fails', () => {
    expect(ir('0.8', '250').status).toBe('fail');
    expect(ir('>999', '100').status).toBe('fail');
  });
});
