// manifest.json of a revision: who issued it and when, the rule set, and the SHA-256 of every
// input file and every output file. The schema is the single source of its type.
import { z } from 'zod';
import { STATUSES } from '../calc/types.js';
import { parseJson } from './json.js';

const sha = z.string().regex(/^[0-9a-f]{64}$/, 'expected a SHA-256 in hex');

export const MANIFEST_FORMAT = 'packsmith-manifest/1';
/** The files of a revision besides manifest.json, in the order they are written. */
export const REVISION_FILES = ['pack.html', 'pack.pdf', 'data.json'] as const;

/** An assessment's counts by status. */
export const SummarySchema = z.object(Object.fromEntries(STATUSES.map((s) => [s, z.number().int().nonnegative()])) as Record<(typeof STATUSES)[number], z.ZodNumber>);

export const ManifestSchema = z.object({
  format: z.literal(MANIFEST_FORMAT),
  packsmith: z.string(),
  job: z.string(),
  title: z.string(),
  firm: z.string(),
  revision: z.object({
    number: z.number().int().positive(),
    date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/),
    by: z.string().min(1),
    reason: z.string().nullable(),
    accepted_open_items: z.boolean(),
  }),
  rules: z.looseObject({ set: z.string(), overrides: z.array(z.string()) }),
  summary: SummarySchema,
  /** the previous revision's manifest, so an altered earlier manifest is found too */
  previous: z.object({ revision: z.number().int().positive(), manifest_sha256: sha }).nullable(),
  input_hash: sha,
  inputs: z.record(z.string(), sha),
  templates_hash: sha,
  outputs: z.record(z.string(), sha),
});

export type Manifest = z.output<typeof ManifestSchema>;

export const manifestBytes = (m: Manifest): string => `${JSON.stringify(m, null, 2)}\n`;

export function parseManifest(text: string): { ok: true; manifest: Manifest } | { ok: false; why: string } {
  const parsed = parseJson(text);
  if (!parsed.ok) return parsed;
  const r = ManifestSchema.safeParse(parsed.value);
  if (!r.success) {
    const first = r.error.issues[0]!;
    return { ok: false, why: `${first.path.join('.') || 'manifest'}: ${first.message}` };
  }
  return { ok: true, manifest: r.data };
}
