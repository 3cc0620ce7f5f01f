// The longest run of a circuit's cable (same sizes, method, device and board) that still meets
// the checks given — by default design Zs, voltage drop from the origin and the adiabatic check.
// Solved by running those very checks on the circuit at trial lengths, never by a second formula:
// from the circuit's own length, steps of 50 % up (while it passes) or down (until it passes)
// bracket the boundary, and bisection finds it. Where the steps down find no passing length (a
// short run can fail the adiabatic check on a large fault current), a grid from 0.5 m to 5 km is
// walked up from the first passing length instead. Where no length passes, null.
import type { Check, CircuitContext } from '../types.js';
import { adiabatic } from '../checks/adiabatic.js';
import { voltageDropCheck } from '../checks/voltage-drop.js';
import { zsDesign } from '../checks/zs-design.js';

export const LENGTH_CHECKS: readonly Check[] = [zsDesign, voltageDropCheck, adiabatic];

const FROM_M = 0.5;
const TO_M = 5000;
const STEP = 1.5;
const BISECTIONS = 18;

/** The circuit as it would be with another length. */
export type AtLength = (lengthM: number) => CircuitContext;

export interface LongestRun {
  /** metres, rounded down to 0.1 m; null where no length passes */
  length_m: number | null;
  /** true where even 5 km passes */
  beyond: boolean;
}

export function longestRun(at: AtLength, ownLengthM: number, checks: readonly Check[] = LENGTH_CHECKS): LongestRun {
  const passes = (l: number) => {
    const ctx = at(l);
    return checks.every((c) => c(ctx).status === 'pass');
  };
  const bracket = (): [number, number] | 'beyond' | null => {
    const own = Math.min(TO_M, Math.max(FROM_M, ownLengthM));
    if (passes(own)) {
      for (let a = own; ; a *= STEP) {
        const b = a * STEP;
        if (b > TO_M) return passes(TO_M) ? 'beyond' : [a, TO_M];
        if (!passes(b)) return [a, b];
      }
    }
    for (let b = own; b > FROM_M; b /= STEP) {
      const a = Math.max(FROM_M, b / STEP);
      if (passes(a)) return [a, b];
    }
    // the shortest runs fail: walk up from 0.5 m to the first passing length, then on to a failure
    let last: number | null = null;
    for (let l = FROM_M; l <= TO_M; l *= STEP) {
      if (passes(l)) last = l;
      else if (last !== null) return [last, l];
    }
    return last === null ? null : 'beyond';
  };
  const found = bracket();
  if (found === null) return { length_m: null, beyond: false };
  if (found === 'beyond') return { length_m: TO_M, beyond: true };
  let [a, b] = found;
  // a only grows and stays below b, so once both round down to the same 0.1 m the answer is known
  for (let n = 0; n < BISECTIONS && Math.floor(a * 10) !== Math.floor(b * 10); n++) {
    const m = (a + b) / 2;
    if (passes(m)) a = m; else b = m;
  }
  return { length_m: Math.floor(a * 10) / 10, beyond: false };
}
