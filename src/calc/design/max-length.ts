// The longest run of a circuit's cable (same sizes, method, device and board) that still meets
// the checks given — by default design Zs, voltage drop from the origin and the adiabatic check.
// Solved by running those very checks on the circuit at trial lengths, never by a second formula:
// a geometric grid from 0.5 m to 5 km (16 % steps) finds the last length that passes, then
// bisection between it and the next failing one. Where no length on the grid passes, null.
import type { Check, CircuitContext } from '../types.js';
import { adiabatic } from '../checks/adiabatic.js';
import { voltageDropCheck } from '../checks/voltage-drop.js';
import { zsDesign } from '../checks/zs-design.js';

export const LENGTH_CHECKS: readonly Check[] = [zsDesign, voltageDropCheck, adiabatic];

const FROM_M = 0.5;
const TO_M = 5000;
const STEPS = 64;
const BISECTIONS = 30;

/** The circuit as it would be with another length. */
export type AtLength = (lengthM: number) => CircuitContext;

export interface LongestRun {
  /** metres, rounded down to 0.1 m; null where no length passes */
  length_m: number | null;
  /** true where even the grid's last length (5 km) passes */
  beyond: boolean;
}

export function longestRun(at: AtLength, checks: readonly Check[] = LENGTH_CHECKS): LongestRun {
  const passes = (l: number) => {
    const ctx = at(l);
    return checks.every((c) => c(ctx).status === 'pass');
  };
  const grid = Array.from({ length: STEPS }, (_, k) => FROM_M * (TO_M / FROM_M) ** (k / (STEPS - 1)));
  let last = -1;
  for (let k = 0; k < grid.length; k++) if (passes(grid[k]!)) last = k;
  if (last < 0) return { length_m: null, beyond: false };
  if (last === grid.length - 1) return { length_m: TO_M, beyond: true };
  let a = grid[last]!;
  let b = grid[last + 1]!;
  for (let n = 0; n < BISECTIONS; n++) {
    const m = (a + b) / 2;
    if (passes(m)) a = m; else b = m;
  }
  return { length_m: Math.floor(a * 10) / 10, beyond: false };
}
