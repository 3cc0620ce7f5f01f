// The rule set: its times, limits and which rules apply are data in src/reference/rule-sets/ (IEC
// 60364 by default, BS 7671 on request; whatever a set does not say is IEC 60364's), with the
// parameters a firm or a job may override in project.yaml. The pack states the set and every
// override; an override less strict than the set's own value is a departure (departures.ts).
import type { Circuit, RuleOverrides, Supply } from '../model/schema.js';
import type { DeviceCode } from '../reference/device-codes.js';
import { TABLE_41_1, DISTRIBUTION_TN_S, DISTRIBUTION_TT_S } from '../reference/disconnection.js';
import { IEC_60364, RULE_SET_DATA, type AdditionalProtection, type Premises, type RuleSet, type RuleSetId } from '../reference/rule-sets/index.js';
import { fmt } from '../model/units.js';
import { hasSockets } from './circuit-facts.js';

export interface DeviceRange {
  breaking_ka?: number | undefined;
  energy_class?: number | undefined;
}

export interface Rules {
  set: RuleSetId;
  /** how the pack names the set, and its documents */
  set_name: string;
  set_source: string;
  premises: Premises;
  u0_v: number;
  cmin: number;
  measured_zs_factor: number;
  vd_lighting_percent: number;
  vd_other_percent: number;
  final_socket_limit_a: number;
  final_fixed_limit_a: number;
  /** the older single limit (kept for readers of 0.1 output): the fixed-equipment limit */
  final_circuit_limit_a: number;
  final_circuit_clause: string;
  /** measured R1+R2 above expected × (1 + percent/100) + ohm is queried */
  r1r2_tolerance_percent: number;
  r1r2_tolerance_ohm: number;
  additional_protection: AdditionalProtection;
  /** the range of devices the job declares, by code */
  devices: Partial<Record<DeviceCode, DeviceRange>>;
  /** the names of the parameters the job overrode */
  overrides: string[];
}

/** The set with everything it does not say filled in from IEC 60364. */
export function ruleSet(id: RuleSetId): RuleSet {
  const d = RULE_SET_DATA[id];
  return {
    ...IEC_60364,
    ...d,
    additional_protection: {
      ...IEC_60364.additional_protection,
      ...d.additional_protection,
      clauses: { ...IEC_60364.additional_protection.clauses, ...d.additional_protection?.clauses },
    },
  };
}

/** The IEC 60364 values (the default set), for callers outside a job (the device command). */
export const DEFAULT_RULES = IEC_60364;

/** The parameters a job may override, each a number of the set. */
export const OVERRIDABLE = [
  'cmin', 'measured_zs_factor', 'vd_lighting_percent', 'vd_other_percent', 'final_socket_limit_a',
  'final_fixed_limit_a', 'r1r2_tolerance_percent', 'r1r2_tolerance_ohm',
] as const;
export type Overridable = (typeof OVERRIDABLE)[number];

export function resolveRules(supply: Supply, overrides: RuleOverrides, premises: Premises = 'dwelling'): Rules {
  const set = ruleSet(overrides.set);
  // the superseded single limit sets both limits, as it did
  const old = overrides.final_circuit_limit_a;
  const given: Partial<Record<Overridable, number>> = {
    ...(old === undefined ? {} : { final_socket_limit_a: old, final_fixed_limit_a: old }),
    ...Object.fromEntries(OVERRIDABLE.filter((k) => overrides[k] !== undefined).map((k) => [k, overrides[k]])),
  };
  const value = (k: Overridable): number => given[k] ?? set[k];
  const named = Object.entries(overrides).filter(([k, v]) => k !== 'set' && k !== 'devices' && v !== undefined).map(([k]) => k);
  return {
    set: set.id,
    set_name: set.name,
    set_source: set.source,
    premises,
    u0_v: supply.u0_v,
    cmin: value('cmin'),
    measured_zs_factor: value('measured_zs_factor'),
    vd_lighting_percent: value('vd_lighting_percent'),
    vd_other_percent: value('vd_other_percent'),
    final_socket_limit_a: value('final_socket_limit_a'),
    final_fixed_limit_a: value('final_fixed_limit_a'),
    final_circuit_limit_a: value('final_fixed_limit_a'),
    final_circuit_clause: set.final_circuit_clause,
    r1r2_tolerance_percent: value('r1r2_tolerance_percent'),
    r1r2_tolerance_ohm: value('r1r2_tolerance_ohm'),
    additional_protection: set.additional_protection,
    devices: overrides.devices ?? {},
    overrides: named,
  };
}

export interface RequiredTime {
  seconds: number;
  basis: string;
  /** the time of the set's own rule, without a circuit's disconnect_s */
  table_s: number;
}

/** The disconnection time a circuit must meet, and why. */
export function requiredDisconnection(
  earthing: Supply['earthing'],
  u0: number,
  circuit: Pick<Circuit, 'rating_a' | 'kind' | 'sockets' | 'disconnect_s'>,
  rules: Rules,
  /** the board this circuit feeds: a distribution circuit */
  feeds?: string,
): RequiredTime {
  const own = feeds !== undefined ? distributionTime(earthing, feeds) : tableTime(earthing, u0, circuit, rules);
  if (circuit.disconnect_s !== undefined) {
    return { seconds: circuit.disconnect_s, table_s: own.seconds, basis: `${fmt(circuit.disconnect_s)} s set for this circuit (the rule set's own: ${own.basis})` };
  }
  return { ...own, table_s: own.seconds };
}

/** A circuit that feeds a board is a distribution circuit (IEC 60364-4-41, 411.3.2.3/411.3.2.4). */
function distributionTime(earthing: Supply['earthing'], feeds: string): { seconds: number; basis: string } {
  const s = earthing === 'TT' ? DISTRIBUTION_TT_S : DISTRIBUTION_TN_S;
  return { seconds: s, basis: `${s} s: distribution circuit feeding ${feeds} (IEC 60364-4-41, 411.3.2.3/411.3.2.4)` };
}

function tableTime(earthing: Supply['earthing'], u0: number, circuit: Pick<Circuit, 'rating_a' | 'kind' | 'sockets'>, rules: Rules): { seconds: number; basis: string } {
  const tt = earthing === 'TT';
  const sockets = hasSockets(circuit);
  const limit = sockets ? rules.final_socket_limit_a : rules.final_fixed_limit_a;
  const what = sockets ? 'final circuit with socket-outlets' : 'final circuit for fixed equipment';
  const clause = rules.final_circuit_clause;
  if (circuit.rating_a > limit) {
    const s = tt ? DISTRIBUTION_TT_S : DISTRIBUTION_TN_S;
    return { seconds: s, basis: `${s} s: ${what} above ${fmt(limit)} A (${clause}; 411.3.2.3/411.3.2.4)` };
  }
  const band = TABLE_41_1.find((b) => u0 > b.u0_above_v && u0 <= b.u0_upto_v);
  if (!band) return { seconds: tt ? DISTRIBUTION_TT_S : DISTRIBUTION_TN_S, basis: `U0 ${u0} V is outside IEC 60364-4-41 Table 41.1` };
  const s = tt ? band.tt_s : band.tn_s;
  return { seconds: s, basis: `${s} s: ${what} up to ${fmt(limit)} A, ${tt ? 'TT' : 'TN'}, U0 ${u0} V (Table 41.1; ${clause})` };
}
