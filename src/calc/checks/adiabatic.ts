// Protective conductor size by the adiabatic equation S = √(I²t) / k (IEC 60364-5-54, 543.1.2 and
// 434.5.2), at both ends of the fault currents the cpc may carry: the minimum (the design earth
// fault at the far end, U0 × Cmin / Zs) and the maximum (at the board: fault-level.ts). The I²t is
// the device's let-through (design/let-through.ts): an upper bound from its characteristic, or,
// where that bound is only I² × the shortest published time, the maker's let_through_a2s or a
// declared energy limiting class. A bound within k²S² passes; the maker's figure above it fails;
// a class limit above it, or no figure at all, is `attention` — never a pass on an assumption, nor
// a fail on an energy the device cannot let through. The equation holds for disconnection within 5 s.
import type { Check, CheckResult, CircuitContext, LengthCheck, Status } from '../types.js';
import { fmt, toPlaces } from '../../model/units.js';
import { ADIABATIC_LIMIT_S, kFor, type KFactor } from '../design/k-factor.js';
import { letThrough, type Energy, type LetThroughInputs } from '../design/let-through.js';
import { earthFaultMax, type Level } from '../fault-level.js';
import { rcdBreakTime } from '../devices/rcd.js';
import { notVerified, result, worst } from './result.js';
import { said, withBasis, type Words } from '../basis.js';

const id = 'adiabatic';

interface Part { status: Status; words: Words; energy: Energy | null }

/** What the circuit and the job say about the device's let-through. */
function inputsOf(ctx: CircuitContext): LetThroughInputs {
  const { circuit, rules, fault } = ctx;
  const range = rules.devices[circuit.device];
  return {
    maker_a2s: circuit.let_through_a2s,
    icn_ka: circuit.breaking_ka ?? range?.breaking_ka,
    energy_class: range?.energy_class,
    ia: fault.known && fault.makerIa ? { ia_a: fault.makerIa, within_s: ctx.derived.required_disconnect_s } : undefined,
  };
}

/** The let-through at a current and how it compares with k²S². */
function judgeAt(ctx: CircuitContext, what: Words, currentA: number, k2s2: number): Part {
  const { circuit, supply } = ctx;
  // the words are formed only where the result's basis is read (see ../basis.ts)
  const at = () => `${said(what)} ${fmt(currentA)} A`;
  // TT with an RCD giving fault protection: it breaks within its time at this residual current
  if (supply.earthing === 'TT' && circuit.rcd_ma !== undefined) {
    const t = rcdBreakTime(circuit.rcd_ma, circuit.rcd_type, currentA);
    if (t) {
      const e = currentA ** 2 * t.time_s;
      const energy = withBasis({ i2t_a2s: e }, () => `I²t ≤ ${fmt(currentA)}² × ${t.time_s} s = ${fmt(e)} A²s (${t.basis})`);
      if (e <= k2s2) return { status: 'pass', words: () => `${at()}: ${energy.basis} ≤ k²S² ${fmt(k2s2)} A²s`, energy };
    }
  }
  const lt = letThrough({ code: circuit.device, rating_a: circuit.rating_a }, currentA, inputsOf(ctx));
  const bound = lt.bound;
  if (!bound) return { status: 'not-verified', words: () => `${at()}: the device is not known to operate at this current`, energy: null };
  if (bound.i2t_a2s <= k2s2) return { status: 'pass', words: () => `${at()}: ${bound.basis} ≤ k²S² ${fmt(k2s2)} A²s`, energy: bound };
  if (!lt.beyondCurve) return { status: 'fail', words: () => `${at()}: ${bound.basis} > k²S² ${fmt(k2s2)} A²s`, energy: bound };
  const better = lt.better;
  if (better) {
    const ok = better.i2t_a2s <= k2s2;
    const status: Status = ok ? 'pass' : better.from === 'maker' ? 'fail' : 'attention';
    const why = !ok && better.from === 'class' ? ' (the class limit is a ceiling: the maker\'s let-through at this fault level may be lower)' : '';
    return { status, words: () => `${at()}: ${better.basis} ${ok ? '≤' : '>'} k²S² ${fmt(k2s2)} A²s${why}`, energy: better };
  }
  return { status: 'attention', words: () => `${at()}: let-through not known (${lt.unknown}); ${bound.basis} > k²S² ${fmt(k2s2)} A²s`, energy: null };
}

/**
 * The energy at the minimum fault current, for the derived minimum cpc: the maker's or the class's
 * figure where one applies, else the characteristic's bound (as a designer works it by hand).
 */
export function minimumFaultEnergy(ctx: CircuitContext): Energy | null {
  const { fault } = ctx;
  if (!fault.known || fault.time_s === null || fault.time_s > ADIABATIC_LIMIT_S) return null;
  const lt = letThrough({ code: ctx.circuit.device, rating_a: ctx.circuit.rating_a }, fault.current_a, inputsOf(ctx));
  return lt.better ?? lt.bound;
}

/**
 * What the check needs that the circuit's length does not change: k, k²S², the largest earth fault
 * current at the board and the let-through at it (worked when first needed, then kept).
 */
interface LengthFree {
  k: KFactor;
  k2s2: number;
  max: Level | null;
  atMax: (ctx: CircuitContext) => Part;
}

function lengthFree(ctx: CircuitContext): LengthFree {
  const { circuit, board, supply, rules } = ctx;
  const k = kFor(circuit.conductor, circuit.insulation, circuit.cpc_in_cable);
  const k2s2 = (k.k * circuit.cpc_mm2) ** 2;
  const max = earthFaultMax(board, supply, rules.u0_v);
  let part: Part | undefined;
  // the maker's Ia that judgeAt reads is the device's, not the length's (design/fault.ts)
  const atMax = (at: CircuitContext) => (part ??= judgeAt(at, () => `maximum earth fault current at ${board.id} (${max!.basis})`, max!.amps, k2s2));
  return { k, k2s2, max, atMax };
}

function judged(ctx: CircuitContext, free: () => LengthFree): CheckResult {
  const { circuit, fault } = ctx;
  if (!fault.known) return notVerified(id, `no design fault current: ${fault.why}`);
  if (!fault.device_known) return notVerified(id, () => `${fault.basis}; the device library has no characteristic for ${fault.opener}, and no device_ia_a from the maker`);
  const time = fault.time_s;
  if (time === null || time > ADIABATIC_LIMIT_S) {
    return result(id, 'fail', () => `${fault.basis}: ${fault.opener} ${time === null ? 'is not known to operate' : `takes ${fmt(time)} s`}; the adiabatic equation needs disconnection within ${ADIABATIC_LIMIT_S} s (IEC 60364-5-54, 543.1.2)`, { value: circuit.cpc_mm2, unit: 'mm2' });
  }
  const { k, k2s2, max, atMax } = free();
  const parts = [judgeAt(ctx, () => `${fault.basis}; minimum fault current`, fault.current_a, k2s2)];
  if (!max) parts.push({ status: 'not-verified', words: 'maximum fault current not known: no prospective fault current, Zdb or Ze recorded', energy: null });
  else if (max.amps > fault.current_a) parts.push(atMax(ctx));
  const status = worst(parts.map((p) => p.status));
  const needed = parts.map((p) => (p.energy ? Math.sqrt(p.energy.i2t_a2s) / k.k : 0)).reduce((a, b) => Math.max(a, b), 0);
  return result(id, status,
    () => `${parts.map((p) => said(p.words)).join('; ')}; k²S² with ${k.basis} and cpc ${fmt(circuit.cpc_mm2)} mm² (IEC 60364-5-54, 543.1.2)`,
    { value: circuit.cpc_mm2, limit: needed > 0 ? toPlaces(needed, 3) : null, unit: 'mm2' });
}

export const adiabatic: Check = (ctx) => judged(ctx, () => lengthFree(ctx));

/**
 * The adiabatic check for one circuit at any length (`base`: the circuit at one of them): its
 * length-free parts worked once. For trials in numbers only (../trial-context.ts): a part kept
 * from one trial keeps that trial's words.
 *
 * It passes at no length where the part judged at the board's largest earth fault current does
 * not pass and that current is above the design fault current at the shortest length: the design
 * fault current If = U0 × Cmin / Zs only falls as the run grows (R1+R2, and Zs with it, grow with
 * the length), so that part is judged at every length, and the check is never better than it.
 */
export function adiabaticAtLengths(base: CircuitContext): LengthCheck {
  let free: LengthFree | undefined;
  const kept = () => (free ??= lengthFree(base));
  const check: LengthCheck = (ctx) => judged(ctx, kept);
  check.passesAtNoLength = (shortest) => {
    const { fault } = shortest;
    if (!fault.known) return false;
    const { max, atMax } = kept();
    return max !== null && max.amps > fault.current_a && atMax(shortest).status !== 'pass';
  };
  return check;
}
