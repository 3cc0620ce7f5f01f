// The longest run of a circuit's cable (same sizes, method, device and board) that still meets
// the checks given — by default design Zs, voltage drop from the origin and the adiabatic check.
// Solved by running those very checks on the circuit at trial lengths, never by a second formula:
// from the circuit's own length, steps of 50 % up (while it passes) or down (until it passes)
// bracket the boundary, and bisection finds it. A check that only worsens with the length (design
// Zs, the drop) is judged once on each side of where its margin says it turns; every other length
// the search asks about is then known from those two (see LengthCheck), so the search ends where
// judging every length would have ended it, at the same 0.1 m. Where the steps down find no
// passing length (a short run can fail the adiabatic check on a large fault current), a grid
// from 0.5 m to 5 km is walked up from the first passing length instead. A check that itself says
// it passes at no length (the adiabatic check, where its part at the board's largest fault
// current, which no length changes, does not pass) is not walked. Where no length passes, null,
// and `whyNone` says which check no length meets and at what status (never a bare "none").
import type { Check, CheckResult, CircuitContext, Status } from '../types.js';
import { fmt } from '../../model/units.js';
import { adiabatic } from '../checks/adiabatic.js';
import { voltageDropCheck } from '../checks/voltage-drop.js';
import { zsDesign } from '../checks/zs-design.js';
import { numbersOnly } from '../basis.js';
import type { TrialContext } from '../trial-context.js';

export const LENGTH_CHECKS: readonly Check[] = [zsDesign, voltageDropCheck, adiabatic];

const FROM_M = 0.5;
const TO_M = 5000;
const STEP = 1.5;
const BISECTIONS = 18;

export interface LongestRun {
  /** metres, rounded down to 0.1 m; null where no length passes */
  length_m: number | null;
  /** true where even 5 km passes */
  beyond: boolean;
  /** the checks that no longer pass 0.1 m beyond the length found (empty when null or beyond) */
  limited_by: string[];
}

/**
 * A circuit tried at other lengths. The longest run, the reason there is none and each remedy's
 * run try many of the same lengths (the same steps from the same own length), and look at each
 * check's status alone: so each length is worked once, each check judged once there, and both
 * in numbers only, without the words no one reads (see ../basis.ts). The circuit's length-free
 * parts are worked once for all lengths (../trial-context.ts).
 */
export class Trials {
  private readonly seen = new Map<number, { ctx: CircuitContext; results: Map<Check, CheckResult> }>();
  /** the check that failed at the last length tried: asked first at the next, where it usually fails again */
  private lastFailed: Check | null = null;
  /** each check asked whether it passes at no length, and its answer */
  private readonly nowhere = new Map<Check, boolean>();
  /**
   * For a check that only worsens with the length, and each way of meeting it: the longest length
   * judged to meet it, the shortest judged not to, and whether its margin has been asked where it
   * turns (see aim).
   */
  private readonly known = new Map<Check, Map<Meets, { meets: number; not: number; aimed: boolean }>>();

  constructor(private readonly circuit: TrialContext) {}

  private tried(lengthM: number) {
    let t = this.seen.get(lengthM);
    if (!t) {
      t = { ctx: numbersOnly(() => this.circuit.at(lengthM)), results: new Map() };
      this.seen.set(lengthM, t);
    }
    return t;
  }

  /** The circuit at this length (its basis lines not worked out). */
  at(lengthM: number): CircuitContext {
    return this.tried(lengthM).ctx;
  }

  /** The check's result at this length: its status, value and limit (its basis line not worked out). */
  judge(check: Check, lengthM: number): CheckResult {
    const t = this.tried(lengthM);
    let r = t.results.get(check);
    if (!r) {
      r = numbersOnly(() => this.circuit.check(check)(t.ctx));
      t.results.set(check, r);
    }
    return r;
  }

  /**
   * Whether one of the checks passes at no length from 0.5 m to 5 km, as it says itself from a
   * part the length does not change (see LengthCheck): then there is no need to walk the lengths
   * to find that none passes.
   */
  passesNowhere(checks: readonly Check[]): boolean {
    return checks.some((check) => {
      let answer = this.nowhere.get(check);
      if (answer === undefined) {
        const prepared = this.circuit.check(check);
        answer = prepared.passesAtNoLength !== undefined && numbersOnly(() => prepared.passesAtNoLength!(this.at(FROM_M)));
        this.nowhere.set(check, answer);
      }
      return answer;
    });
  }

  /**
   * Whether this length meets every check. The checks are pure, so the order they are asked in
   * changes nothing but how many are judged: the one that failed last is asked first.
   */
  meetsAll(checks: readonly Check[], lengthM: number, meets: Meets): boolean {
    const first = this.lastFailed !== null && checks.includes(this.lastFailed) ? this.lastFailed : null;
    if (first && !this.meetsOne(first, lengthM, meets)) return false;
    for (const c of checks) {
      if (c !== first && !this.meetsOne(c, lengthM, meets)) {
        this.lastFailed = c;
        return false;
      }
    }
    return true;
  }

  /**
   * Whether this length meets the check. For a check that only worsens with the length, a length
   * no longer than one judged to meet it meets it, and one no shorter than one judged not to does
   * not (see LengthCheck): only a length between the two is judged.
   */
  meetsOne(check: Check, lengthM: number, meets: Meets): boolean {
    if (!this.circuit.check(check).worsensWithLength) return meets(this.judge(check, lengthM).status);
    const k = this.bounds(check, meets);
    if (lengthM <= k.meets) return true;
    if (lengthM >= k.not) return false;
    const ok = meets(this.judge(check, lengthM).status);
    if (ok) k.meets = lengthM;
    else k.not = lengthM;
    return ok;
  }

  /**
   * Before a search over lengths: each check that only worsens with the length and gives its
   * margin is judged just short of and just past where the margin, taken from the circuit's own
   * length and 5 km, turns; lengths elsewhere are then known without judging (see meetsOne).
   * Where the margin does not say (no margin, or one the length does not change), nothing is
   * judged here and the search judges as it goes.
   */
  aim(checks: readonly Check[], ownLengthM: number, meets: Meets): void {
    for (const check of checks) {
      const { margin, worsensWithLength } = this.circuit.check(check);
      if (!margin || !worsensWithLength) continue;
      const k = this.bounds(check, meets);
      if (k.aimed) continue;
      k.aimed = true;
      const near = ownLengthM === TO_M ? FROM_M : ownLengthM;
      const a = numbersOnly(() => margin(this.at(near)));
      const b = numbersOnly(() => margin(this.at(TO_M)));
      if (a === null || b === null || a === b) continue;
      const turns = near + (a * (TO_M - near)) / (a - b);
      if (!(turns > FROM_M && turns < TO_M)) continue;
      this.meetsOne(check, turns * (1 - AIM), meets);
      this.meetsOne(check, turns * (1 + AIM), meets);
    }
  }

  private bounds(check: Check, meets: Meets) {
    let byMeets = this.known.get(check);
    if (!byMeets) this.known.set(check, (byMeets = new Map()));
    let k = byMeets.get(meets);
    if (!k) byMeets.set(meets, (k = { meets: -Infinity, not: Infinity, aimed: false }));
    return k;
  }

  /** The check's id, the same at every length: from a result already judged, else judged at 0.5 m. */
  idOf(check: Check): string {
    for (const t of this.seen.values()) {
      const r = t.results.get(check);
      if (r) return r.id;
    }
    return this.judge(check, FROM_M).id;
  }
}

/** How far either side of where a margin turns `aim` judges: a millionth of the length, well within the 0.1 m a run is given to. */
const AIM = 1e-6;

/** A length found here, as found (to 0.1 m, rounded down): never rounded up by significant figures. */
export const metres = (m: number): string => `${m} m`;

/** The words a check goes by in the line that says why no length passes. */
const NAMES: Readonly<Record<string, string>> = {
  'zs-design': 'design Zs', 'voltage-drop': 'voltage drop from the origin', adiabatic: 'the adiabatic check',
};
const nameOf = (id: string) => NAMES[id] ?? id;

/** Where the drop up to the board alone leaves no room: "the drop from the origin to DB3 is already 2.99 % of the 3 % allowed". */
export function boardShare(ctx: CircuitContext, r: CheckResult): string {
  const at = ctx.site?.source;
  if (r.id !== 'voltage-drop' || !at || at.vd.percent === null || at.vd.legs.length === 0 || r.limit === null) return '';
  return `: the drop from the origin to ${at.board} is already ${fmt(at.vd.percent)} % of the ${fmt(r.limit)} % allowed`;
}

/**
 * One line saying why no length from 0.5 m to 5 km meets the checks together: each check that no
 * length meets on its own, with its status at the circuit's own length, and how far the others
 * would allow; or, where each alone is met somewhere, that no one length meets them all.
 */
export function whyNone(trials: Trials, ownLengthM: number, checks: readonly Check[] = LENGTH_CHECKS): string {
  const own = trials.at(ownLengthM);
  // whether a check alone passes somewhere needs no more than its own length, where it passes
  // there, or else the search for a bracket; its length, the bracket and the bisection, and that
  // length is printed only where every check passes somewhere
  const alone = checks.map((c) => {
    const result = trials.judge(c, ownLengthM);
    const found = PASSES(result.status) ? undefined : bracketOf(trials, ownLengthM, [c], PASSES);
    return { check: c, result, found };
  });
  const never = alone.filter((a) => a.found === null);
  if (never.length === 0) {
    const each = alone.map((a) => {
      const run = runWithin(trials, a.found ?? bracketOf(trials, ownLengthM, [a.check], PASSES), [a.check], PASSES);
      return `${nameOf(a.result.id)} alone up to ${run.beyond ? 'beyond 5 km' : metres(run.length_m!)}`;
    });
    return `no one length meets them all (${each.join('; ')})`;
  }
  const culprits = never.map((a) => `${nameOf(a.result.id)} passes at no length from ${fmt(FROM_M)} m to ${fmt(TO_M / 1000)} km (${a.result.status} at ${fmt(ownLengthM)} m${boardShare(own, a.result)})`);
  const others = checks.filter((c) => !never.some((a) => a.check === c));
  if (others.length === 0) return culprits.join('; ');
  const rest = longestRun(trials, ownLengthM, others);
  const allow = rest.length_m === null ? '' : `; ${others.map((c) => nameOf(trials.judge(c, ownLengthM).id)).join(' and ')} alone would allow ${rest.beyond ? 'beyond 5 km' : `up to ${metres(rest.length_m)}`}`;
  return `${culprits.join('; ')}${allow}`;
}

/** One line for the schedule: what sets the longest run, or why there is none. */
export function runWords(run: LongestRun, trials: Trials, ownLengthM: number, checks: readonly Check[] = LENGTH_CHECKS): string {
  if (run.length_m === null) return `none: ${whyNone(trials, ownLengthM, checks)}`;
  if (run.beyond) return `every length up to ${fmt(TO_M)} m meets ${checks.map((c) => nameOf(trials.judge(c, ownLengthM).id)).join(', ')}`;
  return `${metres(run.length_m)}, set by ${run.limited_by.map(nameOf).join(' and ')}`;
}

/** What counts as meeting a check: `pass` (the default), or for what would mend a failure, anything but `fail`. */
export type Meets = (status: Status) => boolean;
export const PASSES: Meets = (s) => s === 'pass';

/** Two lengths with the boundary between them (the first meets the checks, the second not), 'beyond' where 5 km meets them, null where no length does. */
type Bracket = [number, number] | 'beyond' | null;

function bracketOf(trials: Trials, ownLengthM: number, checks: readonly Check[], meets: Meets): Bracket {
  // a check that passes nowhere is met nowhere where only a pass will do
  if (meets === PASSES && trials.passesNowhere(checks)) return null;
  trials.aim(checks, ownLengthM, meets);
  const passes = (l: number) => trials.meetsAll(checks, l, meets);
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
}

/** The longest run within a bracket, by bisection. */
function runWithin(trials: Trials, found: Bracket, checks: readonly Check[], meets: Meets): LongestRun {
  if (found === null) return { length_m: null, beyond: false, limited_by: [] };
  if (found === 'beyond') return { length_m: TO_M, beyond: true, limited_by: [] };
  let [a, b] = found;
  // a only grows and stays below b, so once both round down to the same 0.1 m the answer is known
  for (let n = 0; n < BISECTIONS && Math.floor(a * 10) !== Math.floor(b * 10); n++) {
    const m = (a + b) / 2;
    if (trials.meetsAll(checks, m, meets)) a = m; else b = m;
  }
  // every check that turns within the 0.1 m past the run, not only the one the search met there:
  // two checks can turn at the same length (for a circuit-breaker, design Zs and the adiabatic
  // check both turn where the fault current falls to the one that trips it at once)
  const next = Math.min(TO_M, (Math.floor(a * 10) + 1) / 10);
  const limited = checks.filter((c) => !trials.meetsOne(c, b, meets) || !trials.meetsOne(c, next, meets)).map((c) => trials.idOf(c));
  return { length_m: Math.floor(a * 10) / 10, beyond: false, limited_by: limited };
}

export function longestRun(trials: Trials, ownLengthM: number, checks: readonly Check[] = LENGTH_CHECKS, meets: Meets = PASSES): LongestRun {
  return runWithin(trials, bracketOf(trials, ownLengthM, checks, meets), checks, meets);
}
