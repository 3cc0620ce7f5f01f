// Point 10: a rule value less strict than the rule set's own is a departure, listed with the
// circuits it affects; a check that passes only because of it is attention (CONTRACT.md).
import { describe, expect, it } from 'vitest';
import { assess } from '../../src/calc/assess.js';
import { project } from '../helpers/project.js';

const check = (a: ReturnType<typeof assess>, ref: string, id: string) => a.circuits.find((c) => c.ref === ref)!.checks.find((k) => k.id === id)!;

describe('departures', () => {
  it('a longer disconnect_s than Table 41.1 is a departure; the check it alone passes is attention', () => {
    // B32 on 2.5/1.5 mm², 60 m, Ze 0.35: Zs ≈ 1.75 Ω > max Zs 1.37 Ω at 0.4 s (Table 41.1, TN, 230 V);
    // at 5 s a B32 still needs 5 In = 160 A (IEC 60898-1), so Zs fails either way: take a fuse instead.
    // gG 32 A, 30 m: Zs ≈ 1.05 Ω; 0.4 s max Zs 1.04 × 0.95 = 0.99 Ω (BS 7671 Table 41.2), 5 s 1.84 × 0.95 = 1.75 Ω (Table 41.4)
    const a = assess(project([{ device: 'fuse:gG', length_m: '30', disconnect_s: '5', kind: 'heating' }]));
    const zs = check(a, '1', 'zs-design');
    expect(zs.status).toBe('attention');
    expect(zs.basis).toMatch(/passes only by a departure/);
    expect(a.departures).toEqual([expect.objectContaining({ rule: 'disconnect_s', value: 5, set_value: 0.4, circuits: ['DB1/1'] })]);
  });
  it('a disconnect_s shorter than the table is no departure', () => {
    expect(assess(project([{ disconnect_s: '0.2' }])).departures).toEqual([]);
  });
  it('a larger voltage-drop limit is a departure for the circuits it bears on; a check it alone passes is attention', () => {
    // B20 on 2.5 mm², 60 m, 20 A: 2 × 60 × 8.87 mΩ/m × 20 A = 21.3 V = 9.3 % > 5 % (IEC 60364-5-52 Table G.52.1)
    const circuits: Record<string, string>[] = [{ rating_a: '20', length_m: '60', kind: 'heating' }, { kind: 'lighting', rating_a: '6', ib_a: '2', live_mm2: '1.5', cpc_mm2: '1.0' }];
    const a = assess(project(circuits, { rules: { vd_other_percent: 10 } }));
    const vd = check(a, '1', 'voltage-drop');
    expect(vd.status).toBe('attention');
    expect(a.departures).toEqual([expect.objectContaining({ rule: 'vd_other_percent', value: 10, set_value: 5, circuits: ['DB1/1'] })]);
    expect(check(a, '2', 'voltage-drop').status).toBe('pass');
  });
  it('a stricter override is no departure', () => {
    expect(assess(project([{}], { rules: { vd_other_percent: 4, cmin: 0.9, measured_zs_factor: 0.75 } })).departures).toEqual([]);
  });
  it('a larger Cmin or measured-Zs factor, and a lower final-circuit limit, are departures', () => {
    const a = assess(project([{}], { rules: { cmin: 1.0, measured_zs_factor: 0.9, final_fixed_limit_a: 20 } }));
    expect(a.departures.map((d) => d.rule).sort()).toEqual(['cmin', 'final_fixed_limit_a', 'measured_zs_factor']);
  });
});
