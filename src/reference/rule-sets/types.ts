// Source: packsmith's own shape for a rule set (CONTRACT.md, "rules.set"): the times, limits and
// which rules apply, as data. Each set names its clauses beside its values; whatever a set does not
// say falls back to the IEC 60364 set (see rule-sets/index.ts).

export type RuleSetId = 'iec-60364' | 'bs-7671';
export type Premises = 'dwelling' | 'other';

/** Where additional protection by an RCD of IΔn ≤ 30 mA, not time-delayed, is required. */
export interface AdditionalProtection {
  /** socket-outlets with a rated current up to this (A) */
  sockets_upto_a: number;
  /** mobile equipment used outdoors, rated current up to this (A) */
  outdoor_upto_a: number;
  /** luminaires in dwellings (a.c. final circuits supplying them) */
  luminaires_in_dwellings: boolean;
  /** cables concealed < 50 mm deep in a wall or partition without earthed covering or protection */
  concealed_cables: boolean;
  /** the largest residual operating current that counts (mA) */
  max_ma: number;
  /** the set lets a documented reason replace it for socket-outlets other than in dwellings */
  socket_exemption_outside_dwellings: boolean;
  /** the clause of each requirement, for the basis line */
  clauses: { sockets: string; outdoor: string; luminaires: string; concealed: string; exemption: string };
}

export interface RuleSet {
  id: RuleSetId;
  /** how the pack names it */
  name: string;
  /** the documents it is taken from */
  source: string;
  cmin: number;
  measured_zs_factor: number;
  vd_lighting_percent: number;
  vd_other_percent: number;
  /** final circuits with socket-outlets up to this rating take Table 41.1 (411.3.2.2) */
  final_socket_limit_a: number;
  /** final circuits supplying only fixed equipment up to this rating take Table 41.1 (411.3.2.2) */
  final_fixed_limit_a: number;
  r1r2_tolerance_percent: number;
  r1r2_tolerance_ohm: number;
  additional_protection: AdditionalProtection;
  /** the clause that names the final-circuit limits */
  final_circuit_clause: string;
}

/** A set written as what it says differently from IEC 60364. */
export type RuleSetData = Omit<Partial<RuleSet>, 'additional_protection'> & {
  id: RuleSetId;
  name: string;
  source: string;
  additional_protection?: Partial<AdditionalProtection> & { clauses?: Partial<AdditionalProtection['clauses']> };
};
