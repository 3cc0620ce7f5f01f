// The queries on a device's characteristic. All pure; null where the library cannot answer.
import { fmt, significant, type Reading } from '../../model/units.js';
import { INSTANTANEOUS_TIME_S } from '../../reference/circuit-breakers.js';
import { currentFor, show, timeAt } from './curve.js';
import { breakerType, characteristic, type Device } from './lookup.js';
import { withBasis } from '../basis.js';

export interface MaxZs {
  /** current that operates the device within the required time */
  ia_a: number;
  max_zs_ohm: number;
  basis: string;
}

/** Max Zs = U0 × Cmin / Ia for the required disconnection time, or null where no current is known to do it. */
export function maxZs(device: Device, requiredS: number, u0: number, cmin: number): MaxZs | null {
  const c = characteristic(device);
  const ia = c ? currentFor(c.slowest, requiredS) : null;
  if (!ia) return null;
  return {
    ia_a: ia.current_a,
    max_zs_ohm: (u0 * cmin) / ia.current_a,
    basis: `Ia = ${show(ia.current_a)} A, the current that operates it within ${fmt(requiredS)} s (${ia.how})`,
  };
}

/** Operating times at a current: slowest null = not known to operate; fastest null = no fastest edge here. */
export function operatingTime(device: Device, currentA: number): { slowest_s: number | null; fastest_s: number | null } {
  const c = characteristic(device);
  if (!c) return { slowest_s: null, fastest_s: null };
  return { slowest_s: timeAt(c.slowest, currentA), fastest_s: c.fastest ? timeAt(c.fastest, currentA) : null };
}

/** Ia: the smallest current whose slowest operating time is within `timeS`. */
export function currentForTime(device: Device, timeS: number): number | null {
  const c = characteristic(device);
  return c ? currentFor(c.slowest, timeS)?.current_a ?? null : null;
}

/** I²t let through at a fault current, for the adiabatic check; null where the device is not known to operate. */
export function energyAt(device: Device, currentA: number): { i2t_a2s: number; basis: string } | null {
  const c = characteristic(device);
  const t = c ? timeAt(c.slowest, currentA) : null;
  if (!c || t === null) return null;
  const i2t = currentA ** 2 * t;
  const shown = () => `${show(i2t)} A²s`;
  if (breakerType(device.code) && t <= INSTANTANEOUS_TIME_S) {
    return withBasis({ i2t_a2s: i2t }, () => `I²t = ${show(currentA)}² × ${INSTANTANEOUS_TIME_S} s = ${shown()}: the breaker opens within ${INSTANTANEOUS_TIME_S} s at this current and no current limiting is credited (assumption: a manufacturer's let-through I²t, lower, may replace it)`);
  }
  const last = c.slowest.points[c.slowest.points.length - 1]!;
  if (currentA > last.current_a) {
    return withBasis({ i2t_a2s: i2t }, () => `I²t = ${shown()}, held at its value at ${show(last.current_a)} A in ${show(last.time_s)} s (${last.source}): the fuse opens faster here and its let-through is taken as no more than that (assumption)`);
  }
  return withBasis({ i2t_a2s: i2t }, () => `I²t = ${show(currentA)}² × ${show(t)} s = ${shown()} (slowest operating time)`);
}

/**
 * From a measured Zs: the earth fault current U0 × Cmin / Zs and the slowest operating time at it
 * (null: not known to operate). Empty where Zs is not a plain reading or the device has no
 * characteristic, so no derived value pretends to know.
 */
export function measuredFault(
  device: Device, zs: Reading | undefined, u0: number, cmin: number,
): { fault_current_a?: number; disconnect_s?: number | null } {
  if (zs?.kind !== 'value' || !(zs.value > 0)) return {};
  const current = (u0 * cmin) / zs.value;
  if (!characteristic(device)) return { fault_current_a: significant(current) };
  const t = operatingTime(device, current).slowest_s;
  return { fault_current_a: significant(current), disconnect_s: t === null ? null : significant(t) };
}

/**
 * The maker's Ia (device_ia_a) for a device whose characteristic the library does not hold: the
 * current that operates it within the required time. A household fuse (BS 88-3) is never taken as
 * faster than the BS 88-2 fuse of the same rating (published tables: it is the slower of the two),
 * so its Ia is at least that fuse's. Null where the library holds the device or no figure is given.
 */
export function makerIa(device: Device, requiredS: number, givenA: number | undefined): { ia_a: number; basis: string } | null {
  if (givenA === undefined || characteristic(device) !== null) return null;
  if (device.code === 'fuse:bs88-3') {
    const floor = currentForTime({ code: 'fuse:gG', rating_a: device.rating_a }, requiredS);
    if (floor !== null && floor > givenA) {
      return { ia_a: floor, basis: `Ia = ${show(floor)} A: the maker's ${fmt(givenA)} A would make the BS 88-3 fuse faster than the BS 88-2 fuse of the same rating, so that fuse's Ia within ${fmt(requiredS)} s is taken` };
    }
  }
  return { ia_a: givenA, basis: `Ia = ${fmt(givenA)} A within ${fmt(requiredS)} s, the maker's (device_ia_a)` };
}
