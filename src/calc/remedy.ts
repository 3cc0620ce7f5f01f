// What would pass: for a failing design check, the nearest change that would make that same check
// pass, found by running the check on the changed circuit (never guessed): a shorter run (the
// longest length that passes), the next conductor size up, a lower rating or another curve of the
// same family, a separate or larger cpc, or — on a TT supply — an RCD giving fault protection.
// One plain line; where no single change tried passes, it says so. Where no change passes but one
// ends the failure (the check would still want a maker's figure, say), that change is given and
// the line says what the check would then be. Pure.
import type { Circuit } from '../model/schema.js';
import { ratingsMade } from '../model/device-rating.js';
import { fmt } from '../model/units.js';
import { CAPACITY_SIZES_MM2 } from '../reference/capacity.js';
import type { DeviceCode } from '../reference/device-codes.js';
import { sizesOf } from './design/conductor.js';
import { boardShare, longestRun, metres, PASSES, type Meets, type Trials } from './design/max-length.js';
import type { Check, CircuitContext } from './types.js';
import { numbersOnly } from './basis.js';

/** The circuit as it would be with some fields changed. */
export type Changed = (change: Partial<Circuit>) => CircuitContext;

interface Candidate {
  change: Partial<Circuit>;
  words: string;
}

/** A softer curve of the same family: C → B, D → C (a lower instantaneous multiple). */
const SOFTER: Partial<Record<DeviceCode, DeviceCode>> = { 'mcb:C': 'mcb:B', 'mcb:D': 'mcb:C', 'rcbo:C': 'rcbo:B', 'rcbo:D': 'rcbo:C' };

const cable = (c: Circuit, live: number, cpc: number) => `${fmt(live)}/${fmt(cpc)} mm² cable (now ${fmt(c.live_mm2)}/${fmt(c.cpc_mm2)} mm²)`;

function sizesUp(c: Circuit): Candidate[] {
  const live = CAPACITY_SIZES_MM2.filter((s) => s > c.live_mm2).slice(0, 4);
  const cpcs = sizesOf(c.conductor);
  return live.map((l, i) => {
    const cpc = cpcs.filter((s) => s > c.cpc_mm2)[i] ?? c.cpc_mm2;
    return { change: { live_mm2: l, cpc_mm2: Math.min(cpc, l) }, words: cable(c, l, Math.min(cpc, l)) };
  });
}

function liveUp(c: Circuit): Candidate[] {
  return CAPACITY_SIZES_MM2.filter((s) => s > c.live_mm2).slice(0, 4)
    .map((l) => ({ change: { live_mm2: l }, words: `${fmt(l)} mm² live conductors (now ${fmt(c.live_mm2)} mm²)` }));
}

function cpcUp(c: Circuit): Candidate[] {
  return sizesOf(c.conductor).filter((s) => s > c.cpc_mm2 && s <= c.live_mm2).slice(0, 4)
    .map((s) => ({ change: { cpc_mm2: s }, words: `a ${fmt(s)} mm² cpc (now ${fmt(c.cpc_mm2)} mm²)` }));
}

function lowerRatings(c: Circuit): Candidate[] {
  return ratingsMade(c.device).filter((r) => r < c.rating_a && r >= c.ib_a).reverse()
    .map((r) => ({ change: { rating_a: r }, words: `${c.device} ${fmt(r)} A (now ${fmt(c.rating_a)} A; still ≥ Ib ${fmt(c.ib_a)} A)` }));
}

function softerCurve(c: Circuit): Candidate[] {
  const to = SOFTER[c.device];
  return to ? [{ change: { device: to }, words: `${to} ${fmt(c.rating_a)} A (type ${to.slice(-1)} instead of ${c.device.slice(-1)})` }] : [];
}

function rcd(ctx: CircuitContext): Candidate[] {
  return ctx.supply.earthing === 'TT' && ctx.circuit.rcd_ma === undefined
    ? [{ change: { rcd_ma: 30 }, words: 'a 30 mA RCD giving fault protection (TT supply)' }]
    : [];
}

/** The changes to try for a check, nearest first. */
function candidates(id: string, ctx: CircuitContext): Candidate[] {
  const c = ctx.circuit;
  switch (id) {
    case 'overload': return [...lowerRatings(c), ...liveUp(c)];
    case 'voltage-drop': return liveUp(c);
    case 'zs-design':
    case 'disconnection': return [...sizesUp(c), ...softerCurve(c), ...lowerRatings(c), ...rcd(ctx)];
    case 'adiabatic': return [...cpcUp(c), ...softerCurve(c), ...rcd(ctx)];
    case 'cpc-size': return [...cpcUp(c), ...softerCurve(c)];
    default: return [];
  }
}

/** The checks whose failure a change of length can cure (a shorter run raises the smallest fault current). */
const BY_LENGTH = new Set(['voltage-drop', 'zs-design', 'disconnection', 'adiabatic']);

const ENDS_FAILURE: Meets = (s) => s !== 'fail';

/** One plain line: what would make the failing check pass, or null where the check did not fail or is not a design check. */
export function remedy(id: string, check: Check, ctx: CircuitContext, changed: Changed, trials: Trials): string | null {
  // its status, value and limit are read, never its words
  const now = numbersOnly(() => check(ctx));
  if (now.status !== 'fail') return null;
  const tried = candidates(id, ctx);
  if (tried.length === 0 && !BY_LENGTH.has(id)) return null;
  const found = (meets: Meets): string[] => {
    const options: string[] = [];
    if (BY_LENGTH.has(id)) {
      const run = longestRun(trials, ctx.circuit.length_m, [check], meets);
      if (run.length_m !== null && run.length_m < ctx.circuit.length_m) options.push(`a run of at most ${metres(run.length_m)} (now ${fmt(ctx.circuit.length_m)} m)`);
    }
    // only the status of each change tried is read
    const other = tried.find((k) => meets(numbersOnly(() => check(changed(k.change))).status));
    if (other) options.push(other.words);
    return options;
  };
  const passing = found(PASSES);
  if (passing.length > 0) return `would pass with ${passing.join(', or ')}`;
  const mending = found(ENDS_FAILURE);
  if (mending.length > 0) return `would no longer fail with ${mending.join(', or ')} (none of the changes tried makes it pass)`;
  const share = boardShare(ctx, now);
  return `no single change tried passes (${BY_LENGTH.has(id) ? 'a shorter run, ' : ''}${tried.length ? 'the next sizes up, another curve or rating' : 'nothing else to try'})${share || ': the design needs another look'}`;
}
