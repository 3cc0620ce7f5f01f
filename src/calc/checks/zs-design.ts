// Design Zs (Ze or Zdb + R1+R2 at operating temperature) against the max Zs that makes the
// device operate within the required disconnection time.
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { notVerified, result } from './result.js';

export const zsDesign: Check = ({ design, derived, maxZsBasis }) => {
  const id = 'zs-design';
  if (!design.source) return notVerified(id, 'no Ze for the supply and no Zdb for the board: the design Zs cannot be found');
  if (!design.zs) return notVerified(id, 'no conductor resistance for these sizes in IEC 60228');
  if (derived.max_zs_ohm === null) return notVerified(id, `${design.zs.basis}; no max Zs to compare with: ${maxZsBasis}`);
  const ok = design.zs.ohm <= derived.max_zs_ohm;
  return result(id, ok ? 'pass' : 'fail', `${design.zs.basis} ${ok ? '≤' : '>'} max Zs ${fmt(derived.max_zs_ohm)} Ω (${maxZsBasis})`, {
    value: Number(design.zs.ohm.toFixed(3)), limit: derived.max_zs_ohm, unit: 'ohm',
  });
};
