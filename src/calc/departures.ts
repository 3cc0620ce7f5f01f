// Departures: a rule value less strict than the rule set's own — a larger Cmin, measured-Zs factor,
// voltage-drop limit or R1+R2 tolerance, a smaller final-circuit limit (fewer circuits get the
// Table 41.1 time), or a circuit's disconnect_s longer than the set's time for it (CONTRACT.md).
// The pack lists each with the circuits it affects, and a check that passes only because of one is
// `attention` (assess.ts runs it again under the strict rules to know).
import type { Circuit } from '../model/schema.js';
import { fmt } from '../model/units.js';
import { hasSockets } from './circuit-facts.js';
import { ruleSet, type Overridable, type Rules } from './rules.js';

export interface Departure {
  /** the rule: a rules.* parameter, or "disconnect_s" for a circuit's own time */
  rule: string;
  value: number;
  set_value: number;
  basis: string;
  /** BOARD/REF of every circuit it affects */
  circuits: string[];
}

/** Per parameter: which way is less strict, and which circuits it bears on. */
const LOOSER: Record<Overridable, { larger: boolean; words: string; applies: (c: Circuit) => boolean }> = {
  cmin: { larger: true, words: 'voltage factor Cmin', applies: () => true },
  measured_zs_factor: { larger: true, words: 'factor on max Zs for measured Zs', applies: () => true },
  vd_lighting_percent: { larger: true, words: 'voltage drop limit for lighting (%)', applies: (c) => c.kind === 'lighting' },
  vd_other_percent: { larger: true, words: 'voltage drop limit for other uses (%)', applies: (c) => c.kind !== 'lighting' },
  final_socket_limit_a: { larger: false, words: 'largest socket-outlet final circuit given the Table 41.1 time (A)', applies: (c) => hasSockets(c) },
  final_fixed_limit_a: { larger: false, words: 'largest fixed-equipment final circuit given the Table 41.1 time (A)', applies: (c) => !hasSockets(c) },
  r1r2_tolerance_percent: { larger: true, words: 'R1+R2 tolerance (%)', applies: () => true },
  r1r2_tolerance_ohm: { larger: true, words: 'R1+R2 tolerance (Ω)', applies: () => true },
};

/** The rules with every departing value put back to the set's own (stricter overrides kept). */
export function strictRules(rules: Rules): Rules {
  const set = ruleSet(rules.set);
  const out: Rules = { ...rules };
  for (const [k, d] of Object.entries(LOOSER) as [Overridable, (typeof LOOSER)[Overridable]][]) {
    if (d.larger ? rules[k] > set[k] : rules[k] < set[k]) out[k] = set[k];
  }
  out.final_circuit_limit_a = out.final_fixed_limit_a;
  return out;
}

/** The rule-level departures of a job, with the circuits each bears on. */
export function ruleDepartures(rules: Rules, circuits: readonly Circuit[]): Departure[] {
  const set = ruleSet(rules.set);
  const out: Departure[] = [];
  for (const [k, d] of Object.entries(LOOSER) as [Overridable, (typeof LOOSER)[Overridable]][]) {
    const looser = d.larger ? rules[k] > set[k] : rules[k] < set[k];
    if (!looser) continue;
    out.push({
      rule: k,
      value: rules[k],
      set_value: set[k],
      basis: `${d.words} ${fmt(rules[k])} set in project.yaml is less strict than ${set.name}'s ${fmt(set[k])}`,
      circuits: circuits.filter(d.applies).map((c) => `${c.board}/${c.ref}`),
    });
  }
  return out;
}

/** A circuit's own disconnect_s longer than the set's time for it. */
export function circuitDeparture(c: Circuit, tableS: number): Departure | null {
  if (c.disconnect_s === undefined || c.disconnect_s <= tableS) return null;
  return {
    rule: 'disconnect_s',
    value: c.disconnect_s,
    set_value: tableS,
    basis: `${c.board}/${c.ref}: disconnect_s ${fmt(c.disconnect_s)} s set in circuits.csv is longer than the rule set's ${fmt(tableS)} s`,
    circuits: [`${c.board}/${c.ref}`],
  };
}
