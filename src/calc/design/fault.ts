// The design earth fault: If = U0 × Cmin / Zs at the far end of the circuit (design Zs), and how
// the device giving fault protection answers it: the overcurrent device's slowest edge or, on a
// TT supply with an RCD, the RCD's break time. With the time comes the I²t the cpc must take.
import { characteristic, energyAt, makerIa, operatingTime, type Device } from '../devices/index.js';
import { rcdBreakTime } from '../devices/rcd.js';
import type { Circuit, RcdType, Supply } from '../../model/schema.js';
import type { Rules } from '../rules.js';
import { fmt } from '../../model/units.js';
import type { Design } from './index.js';
import { withBasis, withWords } from '../basis.js';

export type DesignFault =
  | { known: false; why: string }
  | {
    known: true;
    current_a: number;
    basis: string;
    /** the device that opens: "mcb:B 32 A" or "the 30 mA RCD" */
    opener: string;
    /** false where the library has no characteristic for it */
    device_known: boolean;
    /** slowest operating time; null where it is not known to operate at this current */
    time_s: number | null;
    /** why the time is what it is */
    timeBasis: string;
    /** energy let through, for the adiabatic check (null where it does not operate) */
    energy: { i2t_a2s: number; basis: string } | null;
    /** the maker's Ia, where the device is known by it alone (device_ia_a) */
    makerIa: number | null;
  };

export interface FaultOptions {
  u0: number;
  cmin: number;
  /** the RCD that gives fault protection (TT supplies), if any */
  rcd: { ma: number; type: RcdType | undefined } | null;
  /** the maker's Ia within the required time, for a device the library does not hold */
  maker?: { ia_a: number; required_s: number; basis: string } | null;
}

/**
 * What the design fault needs but the design: the circuit's device, U0 and Cmin, the RCD giving
 * fault protection on a TT supply, and the maker's Ia within the required time (`requiredS`).
 * None depends on the circuit's length.
 */
export function faultInputs(circuit: Circuit, supply: Supply, rules: Rules, requiredS: number): { device: Device; options: FaultOptions } {
  const device = { code: circuit.device, rating_a: circuit.rating_a };
  const maker = makerIa(device, requiredS, circuit.device_ia_a);
  const rcd = supply.earthing === 'TT' && circuit.rcd_ma !== undefined ? { ma: circuit.rcd_ma, type: circuit.rcd_type } : null;
  return { device, options: { u0: rules.u0_v, cmin: rules.cmin, rcd, maker: maker ? { ...maker, required_s: requiredS } : null } };
}

export function designFault(design: Design, device: Device, o: FaultOptions): DesignFault {
  if (!design.zs) {
    return { known: false, why: design.source ? 'no conductor resistance for these sizes in IEC 60228' : 'no Ze for the supply and no Zdb for the board' };
  }
  const zs = design.zs.ohm;
  const current = (o.u0 * o.cmin) / zs;
  // the words are formed only where they are read: a trial length needs the numbers alone
  const found = <T extends object>(fields: T, opener: () => string, timeBasis: () => string) =>
    withWords(withWords(withBasis(fields, () => `If = U0 ${o.u0} V × Cmin ${o.cmin} / design Zs ${fmt(zs)} Ω = ${fmt(current)} A`), 'opener', opener), 'timeBasis', timeBasis);
  if (o.rcd) {
    const { ma } = o.rcd;
    const t = rcdBreakTime(ma, o.rcd.type, current);
    return found({
      known: true as const, current_a: current, device_known: true,
      time_s: t?.time_s ?? null,
      energy: t ? withBasis({ i2t_a2s: current ** 2 * t.time_s }, () => `I²t = ${fmt(current)}² × ${t.time_s} s = ${fmt(current ** 2 * t.time_s)} A²s (${t.basis})`) : null,
      makerIa: null,
    }, () => `the ${fmt(ma)} mA RCD`, () => (t ? t.basis : `below IΔn ${ma} mA the RCD need not break`));
  }
  const opener = () => `${device.code} ${fmt(device.rating_a)} A`;
  if (characteristic(device) === null && o.maker) {
    const m = o.maker;
    const operates = current >= m.ia_a;
    return found({
      known: true as const, current_a: current, device_known: true,
      time_s: operates ? m.required_s : null,
      energy: operates ? withBasis({ i2t_a2s: current ** 2 * m.required_s }, () => `I²t ≤ ${fmt(current)}² × ${fmt(m.required_s)} s (${m.basis})`) : null,
      makerIa: m.ia_a,
    }, opener, () => (operates ? `${m.basis}; ${fmt(current)} A ≥ Ia` : `${m.basis}; ${fmt(current)} A < Ia`));
  }
  const device_known = characteristic(device) !== null;
  const time = device_known ? operatingTime(device, current).slowest_s : null;
  return found({
    known: true as const, current_a: current, device_known, time_s: time,
    energy: time === null ? null : energyAt(device, current),
    makerIa: null,
  }, opener, () => 'slowest edge of its characteristic');
}
