// Point 14: the household fuse (BS 88-3) is never faster than the BS 88-2 fuse of the same rating
// (BS 7671 Tables 41.2 / 41.4: the BS 88-3 maximum Zs are the lower ones); the library holds a BS
// 88-3 characteristic only with a published point beside it; otherwise the maker's Ia, floored at
// the BS 88-2 fuse's, or not verified.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { characteristic, currentForTime, makerIa } from '../../src/calc/devices/index.js';
import { BS88_3_POINTS, BS88_3_RATINGS_A } from '../../src/reference/fuses-bs88-3.js';
import { disconnection } from '../../src/calc/checks/disconnection.js';
import { context } from '../helpers/context.js';

/** the current that operates the household fuse within t, as packsmith would take it */
const household = (rating: number, t: number, maker: number) =>
  currentForTime({ code: 'fuse:bs88-3', rating_a: rating }, t) ?? makerIa({ code: 'fuse:bs88-3', rating_a: rating }, t, maker)?.ia_a ?? null;

describe('BS 88-3 (fuse system C)', () => {
  it('holds no point without a published source beside it', () => {
    for (const [rating, points] of Object.entries(BS88_3_POINTS)) for (const p of points) expect(p.source, rating).toMatch(/\S{6,}/);
    for (const r of BS88_3_RATINGS_A) if (!BS88_3_POINTS[r]?.length) expect(characteristic({ code: 'fuse:bs88-3', rating_a: r })).toBeNull();
  });
  it('is never faster than BS 88-2 of the same rating, across ratings, times and makers\' figures (property)', () => {
    const ratings = BS88_3_RATINGS_A.filter((r) => currentForTime({ code: 'fuse:gG', rating_a: r }, 5) !== null);
    expect(ratings.length).toBeGreaterThan(3);
    fc.assert(fc.property(fc.constantFrom(...ratings), fc.constantFrom(0.2, 0.4, 1, 5), fc.double({ min: 1, max: 5000, noNaN: true }), (rating, t, maker) => {
      const gg = currentForTime({ code: 'fuse:gG', rating_a: rating }, t);
      const h = household(rating, t, maker);
      if (gg !== null && h !== null) expect(h).toBeGreaterThanOrEqual(gg * (1 - 1e-12));
    }), { numRuns: 500 });
  });
  it('without the maker\'s Ia its checks are not verified; with it they are judged', () => {
    const fuse = { device: 'fuse:bs88-3', rating_a: '20', ib_a: '10' };
    expect(disconnection(context(fuse, {}, { ze_ohm: '0.35' })).status).toBe('not-verified');
    // BS 88-2 20 A at 0.4 s: 230 / 1.77 = 130 A (BS 7671 Table 41.2); If ≈ 335 A here
    expect(disconnection(context({ ...fuse, device_ia_a: '140' }, {}, { ze_ohm: '0.35' })).status).toBe('pass');
    const c = context({ ...fuse, device_ia_a: '100' }, {}, { ze_ohm: '0.35' });
    expect(c.derived.max_zs_ohm).toBeCloseTo((230 * 0.95) / (230 / 1.77), 2); // floored at BS 88-2's Ia
  });
});
