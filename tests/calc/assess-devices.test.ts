// check's derived values come from the device library for every family.
import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { readJob } from '../../src/load/job.js';
import { validate } from '../../src/model/validate.js';
import { assess } from '../../src/calc/assess.js';

const demo = fileURLToPath(new URL('../../projects/tannery-row-refit/', import.meta.url));

describe('assess: max Zs, fault current and disconnection time from the device library', () => {
  const v = validate(readJob(demo));
  if (!v.ok) throw new Error('demo invalid');
  const a = assess(v.project);
  const circuit = (board: string, ref: string) => a.circuits.find((c) => c.board === board && c.ref === ref)!;

  it('gives every circuit of the demo, breakers and fuses alike, a max Zs', () => {
    for (const c of a.circuits) expect(c.derived.max_zs_ohm, `${c.board}/${c.ref}`).not.toBeNull();
  });
  it('a BS 3036 30 A final circuit: 1.09 Ω × 0.95 at 0.4 s', () => {
    // BS 7671 17th edition Table 41.2 (REFERENCE.md) × Cmin 0.95; TN, 230 V final circuit: 0.4 s (IEC 60364-4-41 Table 41.1)
    const c = circuit('DB2', '1');
    expect(c.derived.required_disconnect_s).toBe(0.4);
    expect(c.derived.max_zs_ohm).toBeCloseTo(1.09 * 0.95, 2);
  });
  it('turns the measured Zs into U0 × Cmin / Zs and the slowest time at that current', () => {
    // DB2/1 measured 0.77 Ω: 230 × 0.95 / 0.77 = 284 A, past the 0.4 s point at 211 A (230 / 1.09)
    const c = circuit('DB2', '1');
    expect(c.derived.fault_current_a).toBe(284);
    expect(c.derived.disconnect_s).toBeLessThan(0.4);
    // DB1/10, a B6, re-tested at 1.39 Ω: 157 A ≥ 5 × 6 A → within 0.1 s (IEC 60898-1)
    expect(circuit('DB1', '10').derived).toMatchObject({ fault_current_a: 157, disconnect_s: 0.1 });
  });
});
