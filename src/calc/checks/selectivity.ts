// Selectivity (discrimination) of a feeding circuit's device over the largest device of the board
// it feeds, from the device library's bands: selective where the upstream device's fastest edge
// lies wholly above the downstream device's slowest edge at every current up to the prospective
// fault current at that board (the upstream device must not operate first: IEC 60364-5-53,
// clause 536, from memory; the bands are those of the device standards the library holds). Where the bands meet
// below that current it is `attention`, saying from which current; a circuit that feeds no board
// is `n/a`. RCDs are not compared.
import type { Check } from '../types.js';
import { characteristic, timeAt, type Edge } from '../devices/index.js';
import { fmt, significant } from '../../model/units.js';
import { notApplicable, notVerified, result } from './result.js';

const id = 'selectivity';

/** Time of the upstream fastest edge: below its first current it does not operate; beyond a `none` tail it may operate at once. */
function fastestAt(edge: Edge, i: number): number {
  if (i < edge.points[0]!.current_a) return Infinity;
  return timeAt(edge, i) ?? 0;
}

/** Time of the downstream slowest edge: where it is not known to operate, never. */
const slowestAt = (edge: Edge, i: number): number => timeAt(edge, i) ?? Infinity;

/** The smallest current up to `imax` at which the upstream fastest edge is at or below the downstream slowest edge, or null. */
export function firstOverlap(upFastest: Edge, downSlowest: Edge, imax: number): number | null {
  const overlaps = (i: number) => {
    const tu = fastestAt(upFastest, i);
    return Number.isFinite(tu) && tu <= slowestAt(downSlowest, i);
  };
  const lo = Math.min(upFastest.points[0]!.current_a, downSlowest.points[0]!.current_a) * 0.999;
  if (!(imax > lo)) return null;
  const grid = new Set<number>();
  const steps = 400;
  for (let k = 0; k <= steps; k++) grid.add(lo * (imax / lo) ** (k / steps));
  for (const p of [...upFastest.points, ...downSlowest.points]) {
    for (const f of [1 - 1e-9, 1, 1 + 1e-9]) if (p.current_a * f > lo && p.current_a * f <= imax) grid.add(p.current_a * f);
  }
  const currents = [...grid].sort((a, b) => a - b);
  let below = lo;
  for (const i of currents) {
    if (!overlaps(i)) { below = i; continue; }
    let a = below;
    let b = i;
    for (let n = 0; n < 50 && b - a > 1e-6 * b; n++) {
      const m = Math.sqrt(a * b);
      if (overlaps(m)) b = m; else a = m;
    }
    return b;
  }
  return null;
}

export const selectivity: Check = (ctx) => {
  const feeds = ctx.site?.feeds ?? null;
  if (!feeds) return notApplicable(id, 'feeds no board: selectivity is judged on a circuit that feeds a board');
  const { circuit } = ctx;
  const upName = `${circuit.device} ${fmt(circuit.rating_a)} A`;
  if (!feeds.largest) return notApplicable(id, `feeds ${feeds.board}, which lists no circuits in circuits.csv`);
  const down = feeds.largest;
  const downName = `${down.code} ${fmt(down.rating_a)} A (${feeds.board}/${down.ref}, the largest device on ${feeds.board})`;
  const ka = feeds.source.pfc.used;
  if (ka === null) return notVerified(id, `no prospective fault current at ${feeds.board} (none measured, none at the origin to carry down): the currents to compare up to are not known`);
  const imax = ka * 1000;
  const up = characteristic({ code: circuit.device, rating_a: circuit.rating_a });
  const dn = characteristic({ code: down.code, rating_a: down.rating_a });
  if (!up || !dn) return notVerified(id, `the device library has no characteristic for ${!up ? upName : downName}`);
  if (!up.fastest) {
    return result(id, 'attention', `${upName} (${up.source}) has no published fastest edge, so its band cannot be shown to lie above ${downName}; a maker's selectivity table can settle it`, { value: null, limit: significant(imax), unit: 'A' });
  }
  const from = firstOverlap(up.fastest, dn.slowest, imax);
  const upto = `up to ${fmt(significant(imax))} A, the prospective fault current at ${feeds.board} (${fmt(ka)} kA)`;
  if (from === null) {
    return result(id, 'pass', `the fastest edge of ${upName} (${up.source}) lies above the slowest edge of ${downName} (${dn.source}) at every current ${upto}`, { value: significant(imax), limit: significant(imax), unit: 'A' });
  }
  return result(id, 'attention', `the bands of ${upName} (${up.source}) and ${downName} (${dn.source}) overlap from ${fmt(significant(from))} A, ${upto}: above that current ${upName} may open first (a maker's selectivity table can settle it)`,
    { value: significant(from), limit: significant(imax), unit: 'A' });
};
