// The issued revisions of a job: the rev-N folders of its archive (the truth) and the job's
// revisions.yaml (the record kept beside the job's files, rebuilt from the manifests).
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { stringify } from 'yaml';
import { z } from 'zod';
import { readYaml } from '../load/yaml.js';
import type { LocatedError } from '../load/raw.js';
import type { Manifest } from './manifest.js';
import { writeReplacing } from './files.js';

export const RECORD_FILE = 'revisions.yaml';
const REV_DIR = /^rev-([1-9]\d*)$/;

export const revisionDirName = (n: number): string => `rev-${n}`;

/** The revision numbers present as rev-N folders, ascending. */
export function revisionNumbers(jobOut: string): number[] {
  if (!existsSync(jobOut)) return [];
  return readdirSync(jobOut)
    .map((n) => REV_DIR.exec(n))
    .filter((m): m is RegExpExecArray => m !== null)
    .map((m) => Number(m[1]))
    .sort((a, b) => a - b);
}

const EntrySchema = z.object({
  revision: z.number().int().positive(),
  date: z.string(),
  by: z.string(),
  reason: z.string().nullable().default(null),
  input_hash: z.string(),
  packsmith: z.string(),
  accepted_open_items: z.boolean().default(false),
  /** SHA-256 of the revision's manifest.json as issued (null in a record written before it was kept) */
  manifest_sha256: z.string().nullable().default(null),
});
export type RecordEntry = z.output<typeof EntrySchema>;
const RecordSchema = z.object({ revisions: z.array(EntrySchema) });

export function recordEntry(m: Manifest, manifestSha: string): RecordEntry {
  return {
    revision: m.revision.number,
    date: m.revision.date,
    by: m.revision.by,
    reason: m.revision.reason,
    input_hash: m.input_hash,
    packsmith: m.packsmith,
    accepted_open_items: m.revision.accepted_open_items,
    manifest_sha256: manifestSha,
  };
}

export function readRecord(jobDir: string): { ok: true; entries: RecordEntry[] } | { ok: false; errors: LocatedError[] } {
  const path = join(jobDir, RECORD_FILE);
  if (!existsSync(path)) return { ok: true, entries: [] };
  const { doc, errors } = readYaml(RECORD_FILE, readFileSync(path, 'utf8'));
  if (!doc) return { ok: false, errors };
  const r = RecordSchema.safeParse(doc.data);
  if (!r.success) {
    return {
      ok: false,
      errors: r.error.issues.map((i) => ({ ...doc.positionOf(i.path as PropertyKey[]), message: `${i.path.join('.')}: ${i.message}; this file is written by packsmith issue` })),
    };
  }
  return { ok: true, entries: r.data.revisions };
}

const HEADER = '# Written by `packsmith issue`: one entry per issued revision of this job. Do not edit.\n';

export function writeRecord(jobDir: string, entries: RecordEntry[], beforeRename?: () => void): void {
  const sorted = [...entries].sort((a, b) => a.revision - b.revision);
  writeReplacing(join(jobDir, RECORD_FILE), HEADER + stringify({ revisions: sorted }), beforeRename);
}
