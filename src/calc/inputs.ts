// Inputs the calculation cannot work with: a size, method or condition outside the published
// tables, a three-phase circuit on a single-phase supply, a device used above its rated voltage,
// an RCBO or an RCD type without the residual current rating.
// They are input errors (the folder must be corrected), never guesses. Pure: validation takes
// these rules and locates each problem in circuits.csv.
import type { Circuit, ProjectFile } from '../model/schema.js';
import type { CircuitRule, ProjectRule } from '../model/validate.js';
import { fmt } from '../model/units.js';
import { DEVICE_RATED_VOLTAGE } from '../reference/device-voltage.js';
import { capacityOf } from './design/capacity.js';
import { circuitVoltage } from './circuit-facts.js';
import { treeProblems } from './tree/build.js';

export const outOfTable: CircuitRule = (c: Circuit) => {
  const cap = capacityOf(c);
  return cap.ok ? null : { field: cap.field, message: cap.message };
};

export const phasesOnSupply: CircuitRule = (c: Circuit, file: ProjectFile | null) => {
  if (!file || c.phases !== 3 || file.supply.phases !== 1) return null;
  return { field: 'phases', message: 'found a three-phase circuit; project.yaml gives a single-phase supply (supply.phases: 1)' };
};

export const ratedVoltage: CircuitRule = (c: Circuit, file: ProjectFile | null) => {
  if (!file) return null;
  const rated = DEVICE_RATED_VOLTAGE[c.device];
  const u0 = file.supply.u0_v;
  const v = rated.against === 'earth' ? u0 : circuitVoltage(c.phases, u0);
  if (v <= rated.max_v) return null;
  const what = rated.against === 'earth' ? `U0 ${fmt(u0)} V to earth` : `${fmt(v)} V ${c.phases === 3 ? 'between lines' : '(U0)'}`;
  return { field: 'device', message: `${c.device} is rated up to ${fmt(rated.max_v)} V (${rated.source}); this circuit is at ${what}` };
};

/**
 * An RCBO is an RCD with overcurrent protection (IEC 61009-1), and an RCD type names an RCD: without
 * its residual current rating the RCD would go untested and unjudged (its readings set aside as
 * "no RCD"), so the rating is required.
 */
export const rcdRating: CircuitRule = (c: Circuit) => {
  if (c.rcd_ma !== undefined) return null;
  if (c.device.startsWith('rcbo:')) return { field: 'rcd_ma', message: `found nothing; ${c.device} is an RCBO: give the residual current rating of its RCD element (e.g. 30), so that it is tested and judged` };
  if (c.rcd_type !== undefined) return { field: 'rcd_ma', message: `found nothing; rcd_type gives a type ${c.rcd_type} RCD on this circuit: give its rated residual current (e.g. 30), so that it is tested and judged` };
  return null;
};

export const CALC_RULES: readonly CircuitRule[] = [outOfTable, phasesOnSupply, ratedVoltage, rcdRating];

/** The tree of boards: a feeding circuit that is not in circuits.csv, or a loop, is an input error. */
export const treeRule: ProjectRule = (file, circuitKeys) =>
  treeProblems(file.boards, circuitKeys)
    .map((p) => ({ path: ['boards', p.index, 'fed_by'], message: `boards.${p.index}.${p.message}` }));

export const PROJECT_RULES: readonly ProjectRule[] = [treeRule];
