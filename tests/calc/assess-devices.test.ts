// check's derived values come from the device library for every family.
import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { readJob } from '../../src/load/job.js';
import { validate } from '../../src/model/validate.js';
import { assess } from '../../src/calc/assess.js';
import { context } from '../helpers/context.js';

const demo = fileURLToPath(new URL('../../projects/tannery-row-refit/', import.meta.url));

describe('assess: max Zs, fault current and disconnection time from the device library', () => {
  const v = validate(readJob(demo));
  if (!v.ok) throw new Error('demo invalid');
  const a = assess(v.project);
  const circuit = (board: string, ref: string) => a.circuits.find((c) => c.board === board && c.ref === ref)!;

  it('gives every circuit of the demo, breakers and fuses alike, a max Zs (BS 88-3 from the maker\'s device_ia_a)', () => {
    for (const c of a.circuits) expect(c.derived.max_zs_ohm, `${c.board}/${c.ref}`).not.toBeNull();
  });
  it('a BS 3036 30 A final circuit: 1.09 Ω × 0.95 at 0.4 s', () => {
    // BS 7671 17th edition Table 41.2 (REFERENCE.md) × Cmin 0.95; TN, 230 V final circuit: 0.4 s (IEC 60364-4-41 Table 41.1)
    const c = circuit('DB2', '1');
    expect(c.derived.required_disconnect_s).toBe(0.4);
    expect(c.derived.max_zs_ohm).toBeCloseTo(1.09 * 0.95, 2);
  });
  it('takes the fault current from the design Zs, as in the contract example', () => {
    // DB2/1: design Zs = Zdb 0.34 + 25 m × (4.61 + 12.1) mΩ/m × 1.1965 = 0.84 Ω (IEC 60228 at 70 °C);
    // 230 × 0.95 / 0.84 = 260 A, past the 0.4 s point at 211 A (230 / 1.09, BS 7671 Table 41.2)
    const c = circuit('DB2', '1');
    expect(c.derived.zs_design_ohm).toBeCloseTo(0.34 + (25 * (4.61 + 12.1) * 1.1965) / 1000, 3);
    expect(c.derived.fault_current_a).toBe(260);
    expect(c.derived.disconnect_s).toBeLessThan(0.4);
    // DB1/10, a B6: 230 × 0.95 / 1.57 Ω = 139 A ≥ 5 × 6 A → within 0.1 s (IEC 60898-1)
    expect(circuit('DB1', '10').derived).toMatchObject({ fault_current_a: 139, disconnect_s: 0.1 });
  });
  it('falls back on the measured Zs where no design Zs is known', () => {
    // no Ze, no Zdb: 230 × 0.95 / 0.74 Ω = 295 A ≥ 5 × 32 A → within 0.1 s (IEC 60898-1)
    expect(context({}, { zs_ohm: '0.74' }).derived).toMatchObject({ zs_design_ohm: null, fault_current_a: 295, disconnect_s: 0.1 });
  });
});
