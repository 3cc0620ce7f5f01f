// Measured Zs against the limit of the device that gives fault protection (see fault-protection.ts).
// Against an overcurrent device: measured Zs ≤ measured_zs_factor × max Zs, the factor allowing
// for the conductors being hotter in service than when tested (0.8 by default, common practice).
// Against an RCD on a TT supply: Zs × IΔn ≤ 50 V (IEC 60364-4-41, 411.5.3); the temperature factor
// is not applied there, the limit being far above any conductor resistance. A measured Zs below the
// measured R1+R2, or below Ze (Zdb) at the board, is physically implausible (the loop contains
// both): it is queried as `attention`, never passed.
import type { Check, CircuitContext } from '../types.js';
import { fmt, toPlaces } from '../../model/units.js';
import { faultProtection } from '../fault-protection.js';
import { numberOf, result, unusable } from './result.js';

/** Why a measured Zs cannot be right, or null. */
function implausible(ctx: CircuitContext, zs: number): string | null {
  const r1r2 = ctx.readings.r1r2_ohm?.value;
  if (r1r2?.kind === 'value' && zs < r1r2.value) return `measured Zs is below the measured R1+R2 ${fmt(r1r2.value)} Ω, which is part of the loop`;
  const { zdb_ohm: zdb } = ctx.board;
  const ze = ctx.supply.ze_ohm;
  if (zdb !== undefined && zs < zdb) return `measured Zs is below Zdb ${fmt(zdb)} Ω at ${ctx.board.id}, which is part of the loop`;
  // Ze at the origin is part of every loop, whatever Zdb a board records
  if (ze !== undefined && zs < ze) return `measured Zs is below Ze ${fmt(ze)} Ω, which is part of the loop`;
  return null;
}

export const zsMeasured: Check = (ctx) => {
  const id = 'zs-measured';
  const m = ctx.readings.zs_ohm;
  const missing = unusable(id, 'measured Zs', m);
  if (missing) return missing;
  const zs = numberOf(m!);
  const fp = faultProtection(ctx);
  if (fp.limit_ohm === null) {
    return result(id, 'not-verified', `no limit to compare measured Zs ${fmt(zs.value)} Ω with: ${fp.basis}`, { value: zs.value, over_range: zs.kind === 'at-least', unit: 'ohm', date: m!.date });
  }
  const { rules } = ctx;
  const limit = fp.by === 'rcd' ? fp.limit_ohm : rules.measured_zs_factor * fp.limit_ohm;
  const rule = fp.by === 'rcd'
    ? `${fmt(limit)} Ω (${fp.basis})`
    : `${rules.measured_zs_factor} × max Zs ${fmt(fp.limit_ohm)} Ω = ${fmt(limit)} Ω (the factor corrects the cold reading for the conductors' temperature in service, common practice; fault protection by the overcurrent device: ${ctx.maxZsBasis})`;
  const numbers = { value: zs.value, over_range: zs.kind === 'at-least', limit: toPlaces(limit, 3), unit: 'ohm', date: m!.date };
  if (zs.kind === 'at-least') {
    // ">N" is above N: at or beyond the limit it is a fail
    return zs.value >= limit
      ? result(id, 'fail', `measured Zs above ${fmt(zs.value)} Ω (over range) > ${rule}`, numbers)
      : result(id, 'not-verified', `measured Zs over range (> ${fmt(zs.value)} Ω): cannot show ≤ ${rule}`, numbers);
  }
  const margin = limit - zs.value;
  if (zs.value > limit) return result(id, 'fail', `measured Zs ${fmt(zs.value)} Ω > ${rule}; over by ${fmt(-margin)} Ω`, numbers);
  const words = `measured Zs ${fmt(zs.value)} Ω ≤ ${rule}; margin ${fmt(margin)} Ω`;
  const odd = implausible(ctx, zs.value);
  return odd ? result(id, 'attention', `${words}; but ${odd}: check the readings`, numbers) : result(id, 'pass', words, numbers);
};
