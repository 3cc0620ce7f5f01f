// The protective device library: how fast a device opens at a given fault current.
// This first slice covers circuit-breakers (mcb, rcbo) by their instantaneous tripping limit:
// a fault current at or above the upper multiple k × In trips within 0.1 s (IEC 60898-1), so
// for any required time from 0.1 s to 5 s, Ia = k × In and max Zs = U0 × Cmin / Ia.
// Fuses have no characteristic here yet: their queries answer null and checks stay not-verified.
import type { DeviceCode } from '../../reference/device-codes.js';
import { INSTANTANEOUS, type BreakerType } from '../../reference/circuit-breakers.js';

export interface Device {
  code: DeviceCode;
  rating_a: number;
}

export interface MaxZs {
  /** current that operates the device within the required time */
  ia_a: number;
  max_zs_ohm: number;
  basis: string;
}

function breakerType(code: DeviceCode): BreakerType | null {
  const m = /^(?:mcb|rcbo):([BCD])$/.exec(code);
  return m ? (m[1] as BreakerType) : null;
}

/** Max Zs = U0 × Cmin / Ia for the required disconnection time, or null where not known. */
export function maxZs(device: Device, requiredS: number, u0: number, cmin: number): MaxZs | null {
  const type = breakerType(device.code);
  if (type === null || requiredS < 0.1 || requiredS > 5) return null;
  const k = INSTANTANEOUS[type].upper;
  const ia = k * device.rating_a;
  return {
    ia_a: ia,
    max_zs_ohm: (u0 * cmin) / ia,
    basis: `Ia = ${k} × ${device.rating_a} A = ${ia} A (type ${type} instantaneous trip, IEC 60898-1)`,
  };
}
