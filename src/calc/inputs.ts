// Inputs the calculation cannot work with: a size, method or condition outside the published
// tables. They are input errors (the folder must be corrected), never guesses. Pure: validation
// takes these rules and locates each problem in circuits.csv.
import type { Circuit } from '../model/schema.js';
import type { CircuitRule, ProjectRule } from '../model/validate.js';
import { capacityOf } from './design/capacity.js';
import { treeProblems } from './tree/build.js';

export const outOfTable: CircuitRule = (c: Circuit) => {
  const cap = capacityOf(c);
  return cap.ok ? null : { field: cap.field, message: cap.message };
};

export const CALC_RULES: readonly CircuitRule[] = [outOfTable];

/** The tree of boards: a feeding circuit that is not in circuits.csv, or a loop, is an input error. */
export const treeRule: ProjectRule = (file, circuitKeys) =>
  treeProblems(file.boards, circuitKeys)
    .map((p) => ({ path: ['boards', p.index, 'fed_by'], message: `boards.${p.index}.${p.message}` }));

export const PROJECT_RULES: readonly ProjectRule[] = [treeRule];
