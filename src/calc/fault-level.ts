// Fault levels at a circuit's board. For breaking capacity: the prospective fault current there
// (measured at the board, else at the origin, which is no lower upstream); for a three-phase
// circuit the three-phase value, given, else about 2 × the line–neutral value (common practice,
// REFERENCE.md). For the protective conductor: the largest earth fault current at the board, no
// more than the measured prospective fault current nor than Cmax × U0 / Zdb (Ze where no Zdb).
import type { Board, Circuit, Supply } from '../model/schema.js';
import { fmt } from '../model/units.js';
import { withBasis } from './basis.js';

/** IEC 60909-0 Table 1: maximum voltage factor for LV systems with a +10 % tolerance (from memory) */
export const CMAX = 1.1;

export interface Level {
  amps: number;
  basis: string;
}

/** The prospective fault current a circuit's device must break. */
export function breakingLevel(circuit: Pick<Circuit, 'phases'>, board: Board, supply: Supply): Level | null {
  const atBoard = board.pfc_ka !== undefined;
  const ln = board.pfc_ka ?? supply.pfc_ka;
  const where = atBoard ? `at ${board.id}` : `at the origin (none recorded for ${board.id}; it is no lower upstream)`;
  if (circuit.phases !== 3) return ln === undefined ? null : { amps: ln * 1000, basis: `prospective fault current ${fmt(ln)} kA ${where}` };
  const given = atBoard ? board.pfc_3ph_ka : board.pfc_3ph_ka ?? supply.pfc_3ph_ka;
  if (given !== undefined) return { amps: given * 1000, basis: `three-phase prospective fault current ${fmt(given)} kA ${where}` };
  if (ln === undefined) return null;
  return { amps: 2 * ln * 1000, basis: `three-phase prospective fault current ≈ 2 × ${fmt(ln)} kA line–neutral ${where} = ${fmt(2 * ln)} kA (common practice, where only the line–neutral value is measured)` };
}

/** The largest earth fault current the circuit's cpc may carry: at the board. */
export function earthFaultMax(board: Board, supply: Supply, u0: number): Level | null {
  const pfc = board.pfc_ka ?? supply.pfc_ka;
  const z = board.zdb_ohm ?? supply.ze_ohm;
  const zWords = () => (board.zdb_ohm !== undefined ? `Zdb ${fmt(board.zdb_ohm)} Ω` : `Ze ${fmt(supply.ze_ohm ?? 0)} Ω`);
  const byZ = z !== undefined && z > 0 ? withBasis({ amps: (CMAX * u0) / z }, () => `Cmax ${CMAX} × U0 ${u0} V / ${zWords()} = ${fmt((CMAX * u0) / z)} A (IEC 60909-0)`) : null;
  const byPfc = pfc !== undefined ? withBasis({ amps: pfc * 1000 }, () => `prospective fault current ${fmt(pfc)} kA measured ${board.pfc_ka !== undefined ? `at ${board.id}` : 'at the origin'}`) : null;
  if (byZ && byPfc) return byZ.amps < byPfc.amps ? byZ : byPfc;
  return byZ ?? byPfc;
}
