// A measured value at a fed board that the tree does not explain is queried (`attention`): a Zdb
// lower than at the board that feeds it (a loop impedance cannot fall downstream), or higher than
// the derived one by more than the rule set's continuity tolerance (25 % + 0.05 Ω by default,
// common practice: a poor joint or a longer route than recorded); a prospective fault current
// higher than at the board that feeds it. The derived Zdb is at the conductors' maximum operating
// temperature, so a cooler measurement reads below it. Pure.
import type { Rules } from '../rules.js';
import type { Status } from '../types.js';
import { fmt } from '../../model/units.js';
import type { BoardSource } from './carry.js';

export interface BoardQuery {
  status: Extract<Status, 'pass' | 'attention'>;
  basis: string;
}

export function boardQuery(at: BoardSource, up: BoardSource | undefined, rules: Rules): BoardQuery | null {
  if (at.feed === null || !up) return null;
  const found: string[] = [];
  const fine: string[] = [];
  const z = at.zdb;
  if (z.measured !== null) {
    const floor = up.zdb.test;
    if (floor !== null && z.measured < floor - rules.r1r2_tolerance_ohm) {
      found.push(`Zdb measured at ${at.board} ${fmt(z.measured)} Ω is lower than the ${fmt(floor)} Ω at ${up.board}, which feeds it`);
    } else if (z.derived !== null) {
      const bound = z.derived * (1 + rules.r1r2_tolerance_percent / 100) + rules.r1r2_tolerance_ohm;
      if (z.measured > bound) {
        found.push(`Zdb measured at ${at.board} ${fmt(z.measured)} Ω is above the derived ${fmt(z.derived)} Ω + ${rules.r1r2_tolerance_percent} % + ${rules.r1r2_tolerance_ohm} Ω = ${fmt(bound)} Ω: more than the feeding cable explains (a poor joint or a longer route?)`);
      } else fine.push(`Zdb measured at ${at.board} ${fmt(z.measured)} Ω against ${fmt(z.derived)} Ω derived: plausible`);
    }
  }
  const p = at.pfc;
  if (p.measured !== null && up.pfc.used !== null) {
    if (p.measured > up.pfc.used * (1 + rules.r1r2_tolerance_percent / 100)) {
      found.push(`prospective fault current measured at ${at.board} ${fmt(p.measured)} kA is above the ${fmt(up.pfc.used)} kA at ${up.board}, which feeds it`);
    } else fine.push(`prospective fault current measured at ${at.board} ${fmt(p.measured)} kA${p.derived === null ? '' : ` against ${fmt(p.derived)} kA derived`}: plausible`);
  }
  if (found.length > 0) return { status: 'attention', basis: `queried: ${found.join('; ')}` };
  if (fine.length > 0) return { status: 'pass', basis: fine.join('; ') };
  return null;
}
