// The changes section: what the archive found changed since the previous revision, every field
// and check by its label.
import type { Status } from '../../calc/types.js';
import { checkLabel, circuitFieldLabel, jobFieldLabel, type Label } from '../labels.js';
import { look } from '../status.js';

/** Changes since the previous revision, as the archive found them (values already shown with units). */
export interface Changes {
  /** the revision compared with; null in revision 1 */
  since: { revision: number; date: string } | null;
  /** who issued this revision, when and why; null in a draft */
  issued: { by: string; date: string; reason: string | null } | null;
  circuitsAdded: { board: string; ref: string; description: string }[];
  circuitsRemoved: { board: string; ref: string; description: string }[];
  design: { board: string; ref: string; field: string; before: string; after: string }[];
  readings: { board: string; ref: string; field: string; before: string; after: string }[];
  verdicts: { board: string; ref: string; check: string; before: Status; after: Status }[];
  /** project.yaml and notes.md: supply, rules, boards, parties */
  job: { field: string; before: string; after: string }[];
  /** test sessions added since the previous revision although dated on or before its issue date */
  lateSessions: { file: string; date: string }[];
}

/** A bare number gets the field's unit: "2.5" → "2.5 mm²". */
const withUnitValue = (v: string, l: Label): string => (l.unit && /^-?\d+(\.\d+)?$/.test(v) ? `${v} ${l.unit}` : v);

export function changesView(c: Changes) {
  const count = c.circuitsAdded.length + c.circuitsRemoved.length + c.design.length + c.readings.length + c.verdicts.length + c.job.length + c.lateSessions.length;
  const labelled = <T extends { field: string; before: string; after: string }>(rows: T[], labelOf: (f: string) => Label) =>
    rows.map((r) => {
      const l = labelOf(r.field);
      return { ...r, field: l.label, before: withUnitValue(r.before, l), after: withUnitValue(r.after, l) };
    });
  return {
    ...c,
    design: labelled(c.design, circuitFieldLabel),
    readings: labelled(c.readings, circuitFieldLabel),
    job: labelled(c.job, jobFieldLabel),
    verdicts: c.verdicts.map((v) => ({ ...v, check: checkLabel(v.check), before: look(v.before), after: look(v.after) })),
    count,
  };
}
