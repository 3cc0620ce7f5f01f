// Where one circuit stands in the tree: the values at its board, the board it feeds (if any) and
// the largest device there (for selectivity). Also the loop impedance up to the board in words,
// as the design table shows it. Pure.
import type { Board, Circuit } from '../../model/schema.js';
import type { DeviceCode } from '../../reference/device-codes.js';
import { fmt } from '../../model/units.js';
import type { SourceImpedance } from '../design/impedance.js';
import type { BoardSource } from './carry.js';

export interface FedBoard {
  board: string;
  source: BoardSource;
  /** the largest device on that board (by rating), null where it lists no circuits */
  largest: { ref: string; code: DeviceCode; rating_a: number } | null;
}

export interface CircuitSite {
  source: BoardSource;
  /** the board this circuit feeds; null: a final circuit */
  feeds: FedBoard | null;
}

/**
 * Each board's largest device by rating (the first of equal ones, in the order of circuits.csv),
 * found in one pass: a search of every circuit for each feeding circuit grows with their product.
 */
export function largestOnBoards(circuits: readonly Circuit[]): ReadonlyMap<string, Circuit> {
  const top = new Map<string, Circuit>();
  for (const c of circuits) {
    const a = top.get(c.board);
    if (a === undefined || c.rating_a > a.rating_a) top.set(c.board, c);
  }
  return top;
}

export function siteOf(
  circuit: Circuit, sources: ReadonlyMap<string, BoardSource>, fed: ReadonlyMap<string, string>, largest: ReadonlyMap<string, Circuit>,
): CircuitSite {
  const source = sources.get(circuit.board)!;
  const fedId = fed.get(`${circuit.board}/${circuit.ref}`);
  if (fedId === undefined) return { source, feeds: null };
  const top = largest.get(fedId) ?? null;
  return {
    source,
    feeds: { board: fedId, source: sources.get(fedId)!, largest: top ? { ref: top.ref, code: top.device, rating_a: top.rating_a } : null },
  };
}

/** The loop impedance up to the board that design checks use, in words; null where none is known. */
export function designSource(s: BoardSource): SourceImpedance | null {
  const { derived, measured, design } = s.zdb;
  if (design === null) return null;
  const id = s.board;
  if (s.feed === null) {
    if (measured === null) return { ohm: design, words: `Ze ${fmt(design)} Ω (no Zdb given for ${id}: taken as at the origin)` };
    if (derived !== null && derived > measured) return { ohm: design, words: `Ze ${fmt(derived)} Ω (above the ${fmt(measured)} Ω measured at ${id}: the larger is taken)` };
    return { ohm: design, words: `Zdb ${fmt(measured)} Ω measured at ${id}` };
  }
  if (measured !== null && (derived === null || measured >= derived)) {
    return { ohm: design, words: `Zdb ${fmt(measured)} Ω measured at ${id}${derived === null ? '' : ` (derived ${fmt(derived)} Ω is lower: the larger is taken)`}` };
  }
  return { ohm: design, words: `Zdb ${fmt(design)} Ω at ${id}, derived (${s.zdb.basis})${measured === null ? '' : `; measured ${fmt(measured)} Ω`}` };
}

/** The board as the checks see it: a fed board takes the carried-down Zdb and fault current where none is measured. */
export function boardAsSeen(board: Board, s: BoardSource): Board {
  if (s.feed === null) return board;
  const out: Board = { ...board };
  if (s.zdb.test !== null) out.zdb_ohm = s.zdb.test;
  if (s.pfc.used !== null) out.pfc_ka = s.pfc.used;
  return out;
}
