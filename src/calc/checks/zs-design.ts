// Design Zs (Ze or Zdb + R1+R2 at operating temperature) against the loop impedance the fault
// protection allows: the max Zs that makes the overcurrent device operate within the required
// time, or on a TT supply with an RCD, 50 V / IΔn (see fault-protection.ts).
import type { CircuitContext, LengthCheck } from '../types.js';
import { fmt, toPlaces } from '../../model/units.js';
import { faultProtection } from '../fault-protection.js';
import { notVerified, result, toFiveFigures } from './result.js';

const judge = (ctx: CircuitContext) => {
  const id = 'zs-design';
  const { design } = ctx;
  if (!design.source) return notVerified(id, 'no Ze for the supply and no Zdb for the board: the design Zs cannot be found');
  const zs = design.zs;
  if (!zs) return notVerified(id, 'no conductor resistance for these sizes in IEC 60228');
  const fp = faultProtection(ctx);
  const limit = fp.limit_ohm;
  if (limit === null) return notVerified(id, () => `${zs.basis}; no limit to compare with: ${fp.basis}`);
  const ok = zs.ohm <= limit;
  const op = ok ? '≤' : '>';
  const words = () => `${zs.basis} ${op} ${fmt(limit)} Ω${toFiveFigures(zs.ohm, op, limit, 'Ω')} (${fp.basis})`;
  // Zdb is Ze plus the impedance up to the board: one below Ze is a reading to query
  const { board, supply } = ctx;
  const odd = ok && board.zdb_ohm !== undefined && supply.ze_ohm !== undefined && board.zdb_ohm < supply.ze_ohm;
  return result(id, odd ? 'attention' : ok ? 'pass' : 'fail', odd ? () => `${words()}; but Zdb ${fmt(board.zdb_ohm!)} Ω at ${board.id} is below Ze ${fmt(supply.ze_ohm!)} Ω, which is part of it: check the readings` : words, {
    value: toPlaces(zs.ohm, 3), limit: toPlaces(limit, 3), unit: 'ohm',
  });
};

/**
 * Design Zs only worsens as the run grows: R1+R2 grows with the length and the limit does not. Its
 * margin is the limit less the design Zs, in ohms (see LengthCheck).
 */
export const zsDesign: LengthCheck = Object.assign(judge, {
  worsensWithLength: true as const,
  margin: (ctx: CircuitContext): number | null => {
    const zs = ctx.design.source ? ctx.design.zs : null;
    const limit = zs ? faultProtection(ctx).limit_ohm : null;
    return zs && limit !== null ? limit - zs.ohm : null;
  },
});
