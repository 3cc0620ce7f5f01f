// The rule set: IEC 60364 values for 230/400 V systems, with the parameters a firm or a job may
// override in project.yaml. The pack states the rule set and every override it used.
import type { RuleOverrides, Supply } from '../model/schema.js';
import { FINAL_CIRCUIT_LIMIT_A, TABLE_41_1, DISTRIBUTION_TN_S, DISTRIBUTION_TT_S } from '../reference/disconnection.js';

export interface Rules {
  set: 'iec-60364';
  u0_v: number;
  cmin: number;
  measured_zs_factor: number;
  vd_lighting_percent: number;
  vd_other_percent: number;
  final_circuit_limit_a: number;
  /** measured R1+R2 above expected × (1 + percent/100) + ohm is queried */
  r1r2_tolerance_percent: number;
  r1r2_tolerance_ohm: number;
  /** the names of the parameters the job overrode */
  overrides: string[];
}

export const DEFAULT_RULES = {
  // IEC 60909-0 Table 1 / CENELEC TR 50480: minimum voltage factor for LV fault currents
  cmin: 0.95,
  // allowance for conductor temperature rise in service (common practice)
  measured_zs_factor: 0.8,
  // IEC 60364-5-52 Annex G, Table G.52.1, public LV supply
  vd_lighting_percent: 3,
  vd_other_percent: 5,
  final_circuit_limit_a: FINAL_CIRCUIT_LIMIT_A,
  // measured R1+R2 well above what the cable explains: 25 % + 0.05 Ω (common practice)
  r1r2_tolerance_percent: 25,
  r1r2_tolerance_ohm: 0.05,
} as const;

export function resolveRules(supply: Supply, overrides: RuleOverrides): Rules {
  const given = Object.entries(overrides).filter(([k, v]) => k !== 'set' && v !== undefined).map(([k]) => k);
  return {
    set: overrides.set,
    u0_v: supply.u0_v,
    cmin: overrides.cmin ?? DEFAULT_RULES.cmin,
    measured_zs_factor: overrides.measured_zs_factor ?? DEFAULT_RULES.measured_zs_factor,
    vd_lighting_percent: overrides.vd_lighting_percent ?? DEFAULT_RULES.vd_lighting_percent,
    vd_other_percent: overrides.vd_other_percent ?? DEFAULT_RULES.vd_other_percent,
    final_circuit_limit_a: overrides.final_circuit_limit_a ?? DEFAULT_RULES.final_circuit_limit_a,
    r1r2_tolerance_percent: overrides.r1r2_tolerance_percent ?? DEFAULT_RULES.r1r2_tolerance_percent,
    r1r2_tolerance_ohm: overrides.r1r2_tolerance_ohm ?? DEFAULT_RULES.r1r2_tolerance_ohm,
    overrides: given,
  };
}

export interface RequiredTime {
  seconds: number;
  basis: string;
}

/** The disconnection time a circuit must meet, and why. */
export function requiredDisconnection(
  earthing: Supply['earthing'],
  u0: number,
  ratingA: number,
  rules: Rules,
  circuitOverride?: number,
  /** the board this circuit feeds: a distribution circuit */
  feeds?: string,
): RequiredTime {
  if (circuitOverride !== undefined) return { seconds: circuitOverride, basis: `${circuitOverride} s set for this circuit` };
  const tt = earthing === 'TT';
  if (feeds !== undefined) {
    const s = tt ? DISTRIBUTION_TT_S : DISTRIBUTION_TN_S;
    return { seconds: s, basis: `${s} s: distribution circuit feeding ${feeds} (IEC 60364-4-41, 411.3.2.3/411.3.2.4)` };
  }
  if (ratingA > rules.final_circuit_limit_a) {
    const s = tt ? DISTRIBUTION_TT_S : DISTRIBUTION_TN_S;
    return { seconds: s, basis: `${s} s: circuit above ${rules.final_circuit_limit_a} A (IEC 60364-4-41, 411.3.2.3/411.3.2.4)` };
  }
  const band = TABLE_41_1.find((b) => u0 > b.u0_above_v && u0 <= b.u0_upto_v);
  if (!band) return { seconds: tt ? DISTRIBUTION_TT_S : DISTRIBUTION_TN_S, basis: `U0 ${u0} V is outside IEC 60364-4-41 Table 41.1` };
  const s = tt ? band.tt_s : band.tn_s;
  return { seconds: s, basis: `${s} s: final circuit, ${tt ? 'TT' : 'TN'}, U0 ${u0} V (IEC 60364-4-41 Table 41.1)` };
}
