// Ring final circuits (common practice): the end-to-end readings of line r1 and neutral rn agree
// within 0.05 Ω; the cpc's r2 ≈ r1 × live csa / cpc csa; the cross-connected R1+R2 ≈ (r1 + r2)/4.
// Ends that disagree, or an r2 the cpc size does not explain, is a `fail` (a break, a poor joint,
// an interconnection or a wrong record); a cross-connected reading off the quarter is `attention`
// (higher at a spur or a poor connection at the point measured). Any missing reading: not verified.
import type { Check, CheckResult, Status } from '../types.js';
import { fmt, toPlaces } from '../../model/units.js';
import { RING_TOLERANCE_OHM } from '../../reference/ring.js';
import { latest, notApplicable, numberOf, result, shown, unusable, worst, type Numeric } from './result.js';

const id = 'ring';

/** A reading as the interval it allows: an over-range reading is unbounded above. */
interface Interval { lo: number; hi: number }
const interval = (r: Numeric): Interval => ({ lo: r.value, hi: r.kind === 'at-least' ? Infinity : r.value });
const scale = (a: Interval, k: number): Interval => ({ lo: a.lo * k, hi: a.hi * k });
const add = (a: Interval, b: Interval): Interval => ({ lo: a.lo + b.lo, hi: a.hi + b.hi });

// allowance for the binary representation of decimal readings (0.39 − 0.34 is not exactly 0.05)
const EPS = 1e-9;

/** Whether a − b is surely within ±tol, surely outside, or cannot be told (over-range readings). */
function agreement(a: Interval, b: Interval, tol: number): 'within' | 'outside' | 'unknown' {
  const lo = a.lo - b.hi;
  const hi = a.hi - b.lo;
  if (lo >= -tol - EPS && hi <= tol + EPS) return 'within';
  if (lo > tol + EPS || hi < -tol - EPS) return 'outside';
  return 'unknown';
}

interface Part { status: Status; words: string; deviation: number }

function judge(name: string, a: Numeric, b: Interval, expectation: string, outside: Status, why: string): Part {
  const deviation = Math.abs(a.value - b.lo);
  const got = agreement(interval(a), b, RING_TOLERANCE_OHM);
  const said = `${name} ${shown(a, 'Ω')} ${expectation}`;
  switch (got) {
    case 'within': return { status: 'pass', words: `${said} (within ${RING_TOLERANCE_OHM} Ω)`, deviation };
    case 'outside': return { status: outside, words: `${said}: off by ${fmt(deviation)} Ω, more than ${RING_TOLERANCE_OHM} Ω (${why})`, deviation };
    default: return { status: 'not-verified', words: `${said}: an over-range reading cannot show agreement within ${RING_TOLERANCE_OHM} Ω`, deviation };
  }
}

export const ring: Check = ({ circuit, readings }) => {
  if (!circuit.ring) return notApplicable(id, 'not a ring final circuit');
  const fields = [
    ['ring_r1_ohm', 'end-to-end r1 (line)'],
    ['ring_rn_ohm', 'end-to-end rn (neutral)'],
    ['ring_r2_ohm', 'end-to-end r2 (cpc)'],
    ['r1r2_ohm', 'cross-connected R1+R2'],
  ] as const;
  for (const [field, name] of fields) {
    const missing: CheckResult | null = unusable(id, `${name} of the ring`, readings[field]);
    if (missing) return missing;
  }
  const [r1, rn, r2, cross] = fields.map(([f]) => numberOf(readings[f]!));
  const ratio = circuit.live_mm2 / circuit.cpc_mm2;
  const expectR2 = scale(interval(r1!), ratio);
  const expectCross = scale(add(interval(r1!), interval(r2!)), 1 / 4);
  const parts: Part[] = [
    judge('rn', rn!, interval(r1!), `against r1 ${shown(r1!, 'Ω')}`, 'fail', 'a break, a poor joint or an interconnection'),
    judge('r2', r2!, expectR2, `against r1 × ${fmt(circuit.live_mm2)}/${fmt(circuit.cpc_mm2)} mm² = ${fmt(expectR2.lo)} Ω`, 'fail', 'a break or poor joint in the cpc, or a cpc size other than recorded'),
    judge('R1+R2', cross!, expectCross, `against (r1 + r2)/4 = ${fmt(expectCross.lo)} Ω`, 'attention', 'a spur, or a poor connection at the point measured'),
  ];
  const status = worst(parts.map((p) => p.status));
  const decisive = parts.filter((p) => p.status === status).reduce((a, b) => (b.deviation > a.deviation ? b : a));
  const date = latest(fields.map(([f]) => readings[f]!.date));
  return result(id, status, `${parts.map((p) => p.words).join('; ')} (ring final circuit tests, common practice)`,
    { value: toPlaces(decisive.deviation, 3), limit: RING_TOLERANCE_OHM, unit: 'ohm', date });
};
