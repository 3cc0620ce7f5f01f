// Voltage drop from the origin of the installation to a circuit's far end: the drop of every
// feeding circuit on the way (each at its own design current, carried down in carry.ts) plus the
// circuit's own. IEC 60364-5-52 Annex G (Table G.52.1) states its limits from the origin.
import { fmt } from '../../model/units.js';
import type { VoltageDrop } from '../design/voltage-drop.js';
import type { VdOrigin } from '../types.js';
import type { BoardSource } from './carry.js';

export function originDrop(own: VoltageDrop | null, at: BoardSource | undefined): VdOrigin | null {
  if (!own) return null;
  if (!at) return { percent: own.percent, legs: [] };
  if (at.vd.percent === null) return null;
  return { percent: at.vd.percent + own.percent, legs: at.vd.legs };
}

/** "DB1/4 1.20 % + DB2/3 0.80 % + this circuit 2.10 % = 4.10 % from the origin" */
export function originWords(o: VdOrigin, ownPercent: number): string {
  if (o.legs.length === 0) return `${fmt(o.percent)} % (its board is fed from the origin)`;
  return `${[...o.legs.map((l) => `${l.circuit} ${fmt(l.percent)} %`), `this circuit ${fmt(ownPercent)} %`].join(' + ')} = ${fmt(o.percent)} % from the origin`;
}
