// Inputs the calculation cannot work with: a size, method or condition outside the published
// tables. They are input errors (the folder must be corrected), never guesses. Pure: the caller
// locates each problem in circuits.csv by its row and field.
import type { Project } from '../model/validate.js';
import { capacityOf } from './design/capacity.js';

export interface InputProblem {
  row: number;
  field: string;
  message: string;
}

export function inputProblems(project: Project): InputProblem[] {
  const problems: InputProblem[] = [];
  for (const c of project.circuits) {
    const cap = capacityOf(c);
    if (!cap.ok) problems.push({ row: c.row, field: cap.field, message: cap.message });
  }
  return problems;
}
