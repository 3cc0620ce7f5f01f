// Checks whose assessment is not in packsmith yet. They say so and stay not-verified: never a pass.
import type { Check, CheckId } from '../types.js';
import { notApplicable, notVerified } from './result.js';

export const pending = (id: CheckId, what: string): Check => () =>
  notVerified(id, `${what}: not yet assessed by packsmith; verify by hand`);

export const ringCheck: Check = (ctx) =>
  ctx.circuit.ring ? notVerified('ring', 'ring continuity: not yet assessed by packsmith; verify by hand') : notApplicable('ring', 'not a ring final circuit');

export const rcdCheck: Check = (ctx) =>
  ctx.circuit.rcd_ma === undefined ? notApplicable('rcd', 'no RCD on this circuit') : notVerified('rcd', 'RCD trip times: not yet assessed by packsmith; verify by hand');

export const rcdTtCheck: Check = (ctx) =>
  ctx.supply.earthing !== 'TT' ? notApplicable('rcd-tt', `${ctx.supply.earthing} supply: no earth electrode condition`) : notVerified('rcd-tt', 'RA × IΔn ≤ 50 V: not yet assessed by packsmith; verify by hand');
