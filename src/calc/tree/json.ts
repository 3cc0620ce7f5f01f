// A board of the tree as `check --json` gives it: what feeds it, Zdb and the prospective fault
// current derived and measured side by side (and the value each kind of check uses), and the
// voltage drop from the origin with each feeding circuit's share.
import { significant, toPlacesOrNull } from '../../model/units.js';
import { feedKey } from './build.js';
import type { BoardSource } from './carry.js';

export function boardJson(b: BoardSource) {
  return {
    id: b.board,
    fed_by: b.feed ? feedKey(b.feed) : null,
    zdb_ohm: { derived: toPlacesOrNull(b.zdb.derived, 3), measured: b.zdb.measured, design: toPlacesOrNull(b.zdb.design, 3), test: toPlacesOrNull(b.zdb.test, 3), basis: b.zdb.basis },
    pfc_ka: { derived: b.pfc.derived === null ? null : significant(b.pfc.derived), measured: b.pfc.measured, used: b.pfc.used === null ? null : significant(b.pfc.used), basis: b.pfc.basis },
    vd_origin_percent: toPlacesOrNull(b.vd.percent, 2),
    vd_legs: b.vd.legs.map((l) => ({ circuit: l.circuit, percent: toPlacesOrNull(l.percent, 2) })),
  };
}
