// A board in the installation's tree: what feeds it, what it feeds, Zdb and fault current derived
// and measured side by side, and the voltage drop from the origin to it, leg by leg.
import type { Assessment } from '../../calc/types.js';
import { anchor } from './schedules.js';
import { toPlacesOrNull } from '../../model/units.js';

export function treeView(id: string, assessment: Pick<Assessment, 'boards'>) {
  const all = assessment.boards ?? [];
  const s = all.find((b) => b.board === id);
  if (!s) return null;
  return {
    fedBy: s.feed ? { board: s.feed.board, ref: s.feed.ref, anchor: anchor('circuit', s.feed.board, s.feed.ref), boardAnchor: anchor('board', s.feed.board) } : null,
    feeds: all.filter((b) => b.feed?.board === id).map((b) => ({ board: b.board, ref: b.feed!.ref, anchor: anchor('board', b.board) })),
    zdb: { derived: toPlacesOrNull(s.zdb.derived, 3), measured: s.zdb.measured, design: toPlacesOrNull(s.zdb.design, 3), basis: s.zdb.basis },
    pfc: { derived: toPlacesOrNull(s.pfc.derived, 3), measured: s.pfc.measured, basis: s.pfc.basis },
    vd: toPlacesOrNull(s.vd.percent, 2),
    legs: s.vd.legs.map((l) => ({ circuit: l.circuit, percent: toPlacesOrNull(l.percent, 2) })),
  };
}
