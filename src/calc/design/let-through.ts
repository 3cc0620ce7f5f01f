// The energy (I²t) a device lets through at a fault current, for the protective conductor.
// - Where the current lies within the device's published characteristic, I² × the slowest time at
//   it: an upper bound of what the standard permits.
// - Beyond the last published point the device opens within that point's time (0.1 s for a
//   breaker's instantaneous release), so I² × that time is still an upper bound, but many times the
//   real let-through of a current-limiting device. There the maker's let-through I²t at the board's
//   prospective fault current (let_through_a2s) or the limit of a declared energy limiting class
//   (BS EN 60898-1 Annex ZA) is the figure to use; without either the energy is not known.
// - A device known only by the maker's Ia (device_ia_a) opens within the required time at
//   currents at or above Ia: I² × the required time bounds it.
import { breakerType, characteristic, timeAt, type Device } from '../devices/index.js';
import { ENERGY_CLASS_ICN_KA, ENERGY_CLASS_LIMITS } from '../../reference/energy-classes.js';
import { fmt } from '../../model/units.js';
import { withBasis } from '../basis.js';

export interface Energy {
  i2t_a2s: number;
  basis: string;
}

export interface LetThrough {
  /** an upper bound the characteristic guarantees; null where the device is not known to operate */
  bound: Energy | null;
  /** true where the bound is I² × the shortest published time: far above a limiting device's real let-through */
  beyondCurve: boolean;
  /** the maker's figure or a class limit, where the bound is beyond the curve and one is known */
  better: (Energy & { from: 'maker' | 'class' }) | null;
  /** what is missing, where `better` is null beyond the curve */
  unknown: string | null;
}

export interface LetThroughInputs {
  /** the maker's let-through I²t at the board's prospective fault current */
  maker_a2s?: number | undefined;
  /** the device's rated short-circuit capacity, kA */
  icn_ka?: number | undefined;
  /** the declared energy limiting class */
  energy_class?: number | undefined;
  /** for a device known by the maker's Ia only */
  ia?: { ia_a: number; within_s: number } | undefined;
}

/** The class limit of BS EN 60898-1 Annex ZA, where the device and its Icn are in the table. */
export function classLimit(device: Device, cls: number | undefined, icnKa: number | undefined): Energy | string {
  if (cls === undefined) return 'no energy limiting class declared for it (rules.devices)';
  if (cls === 1) return 'energy limiting class 1 sets no limit';
  const type = breakerType(device.code);
  const col = ENERGY_CLASS_ICN_KA.indexOf(icnKa as (typeof ENERGY_CLASS_ICN_KA)[number]);
  if (icnKa === undefined || col < 0) return `its Icn (${icnKa === undefined ? 'not given' : `${fmt(icnKa)} kA`}) is not one of the ${ENERGY_CLASS_ICN_KA.join(', ')} kA columns of BS EN 60898-1 Annex ZA`;
  const row = ENERGY_CLASS_LIMITS.find((r) => r.type === type && r.cls === cls && device.rating_a > r.above_a && device.rating_a <= r.upto_a);
  if (!row) return `BS EN 60898-1 Annex ZA gives no class ${cls} limit for ${device.code} ${fmt(device.rating_a)} A`;
  const v = row.i2t_a2s[col]!;
  return withBasis({ i2t_a2s: v }, () => `energy limiting class ${cls}, Icn ${fmt(icnKa)} kA: I²t ≤ ${fmt(v)} A²s (BS EN 60898-1 Annex ZA)`);
}

/** The maker's let-through figure. */
const maker = (a2s: number) => withBasis({ from: 'maker' as const, i2t_a2s: a2s },
  () => `let-through I²t ${fmt(a2s)} A²s from the maker (let_through_a2s, at the board's prospective fault current)`);

export function letThrough(device: Device, currentA: number, o: LetThroughInputs): LetThrough {
  const c = characteristic(device);
  if (!c) {
    if (o.ia && currentA >= o.ia.ia_a) {
      // only "within the required time" is known: a loose bound, like the one beyond a curve
      const ia = o.ia;
      const e = currentA ** 2 * ia.within_s;
      const bound = withBasis({ i2t_a2s: e }, () => `I²t ≤ ${fmt(currentA)}² × ${fmt(ia.within_s)} s = ${fmt(e)} A²s (it opens within ${fmt(ia.within_s)} s at ${fmt(ia.ia_a)} A and above, the maker's Ia)`);
      if (o.maker_a2s !== undefined) return { bound, beyondCurve: true, better: maker(o.maker_a2s), unknown: null };
      return { bound, beyondCurve: true, better: null, unknown: 'no let_through_a2s from the maker' };
    }
    return { bound: null, beyondCurve: false, better: null, unknown: null };
  }
  const t = timeAt(c.slowest, currentA);
  if (t === null) return { bound: null, beyondCurve: false, better: null, unknown: null };
  const last = c.slowest.points[c.slowest.points.length - 1]!;
  if (currentA < last.current_a) {
    const e = currentA ** 2 * t;
    return { bound: withBasis({ i2t_a2s: e }, () => `I²t = ${fmt(currentA)}² × ${fmt(t)} s = ${fmt(e)} A²s (slowest operating time)`), beyondCurve: false, better: null, unknown: null };
  }
  const e = currentA ** 2 * last.time_s;
  const bound = withBasis({ i2t_a2s: e }, () => `I²t ≤ ${fmt(currentA)}² × ${fmt(last.time_s)} s = ${fmt(e)} A²s (it opens within ${fmt(last.time_s)} s from ${fmt(last.current_a)} A: ${last.source})`);
  if (o.maker_a2s !== undefined) {
    return { bound, beyondCurve: true, better: maker(o.maker_a2s), unknown: null };
  }
  if (breakerType(device.code)) {
    const cl = classLimit(device, o.energy_class, o.icn_ka);
    if (typeof cl !== 'string') {
      if (o.icn_ka !== undefined && currentA <= o.icn_ka * 1000) return { bound, beyondCurve: true, better: withBasis({ from: 'class' as const, i2t_a2s: cl.i2t_a2s }, () => cl.basis), unknown: null };
      return { bound, beyondCurve: true, better: null, unknown: `the fault current ${fmt(currentA)} A is above the Icn the class limit holds for` };
    }
    return { bound, beyondCurve: true, better: null, unknown: `no let_through_a2s from the maker, and ${cl}` };
  }
  return { bound, beyondCurve: true, better: null, unknown: 'no let_through_a2s from the maker, whose figure is usually far lower than this bound' };
}
