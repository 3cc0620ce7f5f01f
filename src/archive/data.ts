// data.json: the validated job and its assessment, as plain JSON in a fixed order. A revision
// keeps it beside its pack (and inside its PDF); the next revision's changes are computed from it.
import type { Project } from '../model/validate.js';
import type { Assessment } from '../calc/types.js';
import { circuitKey, type CircuitReadings } from '../model/readings.js';
import { parseJson } from './json.js';

export const DATA_FORMAT = 'packsmith-data/1';

export interface RevisionInfo {
  number: number;
  date: string;
  by: string;
  reason: string | null;
}

export interface PackData {
  format: typeof DATA_FORMAT;
  packsmith: string;
  job: string;
  /** null for a draft */
  revision: RevisionInfo | null;
  project: Project['file'];
  circuits: Project['circuits'];
  /** "board/ref" → the merged readings, in circuit order */
  readings: Record<string, CircuitReadings>;
  sessions: Project['sessions'];
  notes: string | null;
  assessment: Assessment;
}

export function packData(project: Project, assessment: Assessment, packsmith: string, revision: RevisionInfo | null): PackData {
  const readings: Record<string, CircuitReadings> = {};
  for (const c of project.circuits) {
    const key = circuitKey(c.board, c.ref);
    const r = project.readings.get(key);
    if (r) readings[key] = r;
  }
  return {
    format: DATA_FORMAT,
    packsmith,
    job: project.name,
    revision,
    project: project.file,
    circuits: project.circuits,
    readings,
    sessions: project.sessions,
    notes: project.notes,
    assessment,
  };
}

export const dataBytes = (data: PackData): string => `${JSON.stringify(data, null, 2)}\n`;

/** A data.json written by this format of packsmith, or why it cannot be read. */
export function parseData(text: string): { ok: true; data: PackData } | { ok: false; why: string } {
  const parsed = parseJson(text);
  if (!parsed.ok) return parsed;
  const format = (parsed.value as { format?: unknown } | null)?.format;
  if (format !== DATA_FORMAT) return { ok: false, why: `format "${String(format)}", expected "${DATA_FORMAT}"` };
  return { ok: true, data: parsed.value as PackData };
}
