// The design earth fault: If = U0 × Cmin / Zs at the far end of the circuit (design Zs), and how
// the protective device answers it (slowest edge of its characteristic).
import { characteristic, operatingTime, type Device } from '../devices/index.js';
import { fmt } from '../../model/units.js';
import type { Design } from './index.js';

export type DesignFault =
  | { known: false; why: string }
  | { known: true; current_a: number; basis: string; device_known: boolean; time_s: number | null };

export function designFault(design: Design, device: Device, u0: number, cmin: number): DesignFault {
  if (!design.zs) {
    return { known: false, why: design.source ? 'no conductor resistance for these sizes in IEC 60228' : 'no Ze for the supply and no Zdb for the board' };
  }
  const current = (u0 * cmin) / design.zs.ohm;
  const basis = `If = U0 ${u0} V × Cmin ${cmin} / design Zs ${fmt(design.zs.ohm)} Ω = ${fmt(current)} A`;
  const device_known = characteristic(device) !== null;
  return { known: true, current_a: current, basis, device_known, time_s: device_known ? operatingTime(device, current).slowest_s : null };
}
