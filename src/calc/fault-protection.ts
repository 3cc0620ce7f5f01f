// Which device gives fault protection (automatic disconnection) for a circuit, and the loop
// impedance it needs. On a TT supply a circuit with an RCD is protected by the RCD: Zs × IΔn ≤
// 50 V (the condition of IEC 60364-4-41, 411.5.3, applied to the loop). Otherwise the overcurrent
// device must open within the required time: Zs ≤ max Zs = U0 × Cmin / Ia. One rule, used by
// every check that judges a loop impedance (design or measured).
import { fmt } from '../model/units.js';
import { TOUCH_VOLTAGE_LIMIT_V } from '../reference/touch-voltage.js';
import type { CircuitContext } from './types.js';
import { withBasis } from './basis.js';

export interface FaultProtection {
  by: 'rcd' | 'overcurrent';
  /** the highest loop impedance the protection allows, or null where it is not known */
  limit_ohm: number | null;
  /** the rule and the numbers behind the limit */
  basis: string;
}

export function faultProtection(ctx: Pick<CircuitContext, 'circuit' | 'supply' | 'maxZsOhm' | 'maxZsBasis'>): FaultProtection {
  const { circuit, supply } = ctx;
  if (supply.earthing === 'TT' && circuit.rcd_ma !== undefined) {
    const ma = circuit.rcd_ma;
    const limit = TOUCH_VOLTAGE_LIMIT_V / (ma / 1000);
    return withBasis({ by: 'rcd' as const, limit_ohm: limit },
      () => `TT supply, fault protection by the ${fmt(ma)} mA RCD: Zs × IΔn ≤ ${TOUCH_VOLTAGE_LIMIT_V} V, so Zs ≤ ${TOUCH_VOLTAGE_LIMIT_V} V / ${fmt(ma)} mA = ${fmt(limit)} Ω (IEC 60364-4-41, 411.5.3)`);
  }
  // the limit as worked out, not its rounding in the tables (which may lie above it)
  const max = ctx.maxZsOhm;
  const { maxZsBasis } = ctx;
  return withBasis({ by: 'overcurrent' as const, limit_ohm: max }, () => (max === null
    ? `fault protection by the overcurrent device; ${maxZsBasis}`
    : `fault protection by the overcurrent device: max Zs ${fmt(max)} Ω for ${maxZsBasis}`));
}
