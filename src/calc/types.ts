// The Assessment: what calc returns for a Project. Shapes follow CONTRACT.md (`check --json`).
import type { Board, Supply } from '../model/schema.js';
import type { CircuitRecord } from '../model/validate.js';
import type { CircuitReadings } from '../model/readings.js';
import type { Rules } from './rules.js';
import type { Design } from './design/index.js';
import type { DesignFault } from './design/fault.js';
import type { BoardSource, VdLeg } from './tree/carry.js';
import type { CircuitSite } from './tree/site.js';
import type { DeviceCode } from '../reference/device-codes.js';
import type { Departure } from './departures.js';

export const STATUSES = ['pass', 'fail', 'attention', 'not-verified', 'n/a'] as const;
export type Status = (typeof STATUSES)[number];

export const CHECK_IDS = [
  'overload', 'voltage-drop', 'zs-design', 'disconnection', 'adiabatic', 'breaking-capacity',
  'continuity', 'ring', 'insulation', 'polarity', 'zs-measured', 'rcd', 'rcd-tt',
  'additional-protection', 'cpc-size', 'selectivity',
] as const;
export type CheckId = (typeof CHECK_IDS)[number];

export interface CheckResult {
  id: CheckId;
  status: Status;
  value: number | null;
  limit: number | null;
  unit: string | null;
  /** one line naming the numbers and the rule, so a reader can redo it by hand */
  basis: string;
  /** the test date of the reading judged, where a reading was judged */
  date?: string;
  /** present (true) when value is an instrument's over-range reading: a lower bound, ">value" */
  over_range?: true;
  /**
   * Where a later session re-judged this check: its verdict as of each session that changed it,
   * oldest first, the last entry being this result. Absent when it was judged once.
   */
  history?: HistoryEntry[];
  /** on a failing design check: the nearest change that would pass it, computed (one plain line) */
  remedy?: string;
}

export interface HistoryEntry {
  date: string;
  value: number | null;
  over_range?: true;
  status: Status;
}

export interface Derived {
  max_zs_ohm: number | null;
  required_disconnect_s: number;
  [key: string]: number | null;
}

/** Everything a check may look at for one circuit. */
export interface CircuitContext {
  circuit: CircuitRecord;
  board: Board;
  supply: Supply;
  rules: Rules;
  readings: CircuitReadings;
  derived: Derived;
  /** the circuit's design table (Iz, R1+R2, design Zs, voltage drop) */
  design: Design;
  /** the design earth fault at the far end, and the device's answer to it */
  fault: DesignFault;
  /** why the required disconnection time is what it is */
  requiredBasis: string;
  /** why max Zs is what it is (or why it is unknown) */
  maxZsBasis: string;
  /**
   * max Zs as worked out, the limit the checks compare with; derived.max_zs_ohm is its rounding to
   * 3 places for the tables, which may lie up to 0.5 mΩ above it
   */
  maxZsOhm: number | null;
  /** where the circuit stands in the tree of boards (absent: a board fed from the origin, as given) */
  site?: CircuitSite;
  /** voltage drop from the origin to the far end (null where a feeding circuit's drop is not known) */
  vdOrigin?: VdOrigin | null;
}

export interface VdOrigin {
  percent: number;
  /** the feeding circuits from the origin to the circuit's board */
  legs: VdLeg[];
}

export type Check = (ctx: CircuitContext) => CheckResult;

/**
 * A check prepared to judge one circuit at many lengths (trial-context.ts). It may also say that
 * it passes at no length at all, given the circuit at the shortest length tried: where a part of
 * the check that the length does not change already keeps it from passing.
 *
 * Or that it only worsens as the run grows (`worsensWithLength`): where it passes at a length it
 * passes at every shorter one, and where it fails at a length it fails at every longer one (design
 * Zs and the voltage drop: R1+R2 and the drop grow with the length, the limits do not). Then a
 * length between one that met it and one that did not is all a search needs to judge, and
 * `margin` (how far inside its limit the circuit is at a length, in the check's own numbers, which
 * the length changes in proportion) points the search at the length where it turns. The margin
 * only says where to look: the check itself judges there.
 */
export type LengthCheck = Check & {
  passesAtNoLength?: (shortest: CircuitContext) => boolean;
  readonly worsensWithLength?: true;
  readonly margin?: (ctx: CircuitContext) => number | null;
};

export interface CircuitAssessment {
  board: string;
  ref: string;
  description: string;
  derived: Derived;
  /** what sets `derived.max_length_m` (the check that stops passing beyond it), or why there is none */
  max_length_basis?: string;
  checks: CheckResult[];
  /** a circuit that feeds a board: the board, its largest device and the fault current there (for selectivity) */
  feeds?: { board: string; largest: { ref: string; code: DeviceCode; rating_a: number } | null; fault_current_a: number | null };
}

export type Summary = Record<Status, number>;

export interface Assessment {
  job: string;
  rules: Rules;
  /** the tree of boards: what feeds each, and the values carried down to it */
  boards?: BoardSource[];
  circuits: CircuitAssessment[];
  summary: Summary;
  /** rule values less strict than the rule set's own, each with the circuits it affects */
  departures: Departure[];
}
