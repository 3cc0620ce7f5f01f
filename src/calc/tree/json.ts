// A board of the tree as `check --json` gives it: what feeds it, Zdb and the prospective fault
// current derived and measured side by side (and the value each kind of check uses), and the
// voltage drop from the origin with each feeding circuit's share.
import { significant, toPlaces } from '../../model/units.js';
import { feedKey } from './build.js';
import type { BoardSource } from './carry.js';

const n = (v: number | null, places: number) => (v === null ? null : toPlaces(v, places));

export function boardJson(b: BoardSource) {
  return {
    id: b.board,
    fed_by: b.feed ? feedKey(b.feed) : null,
    zdb_ohm: { derived: n(b.zdb.derived, 3), measured: b.zdb.measured, design: n(b.zdb.design, 3), test: n(b.zdb.test, 3), basis: b.zdb.basis },
    pfc_ka: { derived: b.pfc.derived === null ? null : significant(b.pfc.derived), measured: b.pfc.measured, used: b.pfc.used === null ? null : significant(b.pfc.used), basis: b.pfc.basis },
    vd_origin_percent: n(b.vd.percent, 2),
    vd_legs: b.vd.legs.map((l) => ({ circuit: l.circuit, percent: n(l.percent, 2) })),
  };
}
