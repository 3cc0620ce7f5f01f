// packsmith device: a characteristic looked up from the command line (CONTRACT.md).
import { describe, expect, it } from 'vitest';
import { run } from '../helpers/cli.js';

describe('packsmith device', () => {
  it('gives the JSON of CONTRACT.md for a 30 A semi-enclosed fuse at 140 A', async () => {
    const r = await run(['device', 'fuse:bs3036', '30', '--at', '140', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j).toMatchObject({ device: 'fuse:bs3036', rating_a: 30, u0_v: 230, cmin: 0.95 });
    // trade fact (common practice): opens between 0.4 s and 1.5 s; BS 3036 publishes no fastest edge
    expect(j.at.current_a).toBe(140);
    expect(j.at.slowest_s).toBeGreaterThanOrEqual(0.4);
    expect(j.at.slowest_s).toBeLessThanOrEqual(1.5);
    expect(j.at.fastest_s).toBeNull();
    // BS 7671 Tables 41.2 / 41.4 × Cmin 0.95: the figures of CONTRACT.md's example
    expect(j.within).toEqual([{ time_s: 0.4, ia_a: 211, max_zs_ohm: 1.04 }, { time_s: 5, ia_a: 87.1, max_zs_ohm: 2.51 }]);
  });
  it('takes --within, --u0 and --cmin with units', async () => {
    const r = await run(['device', 'mcb:b', '32', '--within', '400 ms', '--u0', '240', '--cmin', '1', '--json']);
    expect(r.code).toBe(0);
    // 240 V / (5 × 32 A): the instantaneous trip of a type B (IEC 60898-1)
    expect(JSON.parse(r.stdout).within).toEqual([{ time_s: 0.4, ia_a: 160, max_zs_ohm: 1.5 }]);
    expect(JSON.parse(r.stdout).at).toBeUndefined();
  });
  it('prints a readable answer without --json', async () => {
    const r = await run(['device', 'mcb:B', '32', '--at', '317']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/at 317 A: operates within 0\.1 s/);
    expect(r.stdout).toMatch(/within 0\.4 s: Ia 160 A, max Zs 1\.37 Ω/); // BS 7671:2018 Table 41.3
  });
  it('says "not known to operate" below the conventional tripping current', async () => {
    const r = await run(['device', 'mcb:B', '32', '--at', '40', '--json']);
    expect(JSON.parse(r.stdout).at.slowest_s).toBeNull(); // 40 A < 1.45 × 32 A (IEC 60898-1 Table 7)
  });
  it.each([
    [['device', 'mcb:E', '32'], /device code "mcb:E"; expected one of mcb:B/],
    [['device', 'mcb:B', '7'], /found 7 A; mcb:B \(IEC 60898-1\) is made in 6, 8, 10/],
    [['device', 'fuse:bs3036', '25'], /twisted together/],
    [['device', 'mcb:B'], /missing required argument 'rating'/],
    [['device', 'mcb:B', '32', '--at', 'lots'], /--at: found "lots"/],
    [['device', 'mcb:B', '32', '--colour'], /unknown option '--colour'/],
  ])('refuses %j plainly with exit 2', async (args, message) => {
    const r = await run(args);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^packsmith( device)?: /); // usage errors come from the parser as packsmith: ...
    expect(r.stderr).toMatch(message);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });
});
