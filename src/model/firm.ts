// The firm file's schema (`packsmith.yaml`): the project.yaml fields that make sense for a whole
// firm, plus where its issued revisions live and its public key. Picked from the project's own
// schema, so a field added there for firms is described and checked here too.
import { z } from 'zod';
import { FIRM_PROJECT_FIELDS } from '../load/firm.js';
import { ProjectFileSchema } from './schema.js';
import { word } from './cells.js';

const shape = ProjectFileSchema.shape as Record<string, z.ZodType>;
const unwrap = (s: z.ZodType): z.ZodType => (s instanceof z.ZodDefault || s instanceof z.ZodOptional ? (s.unwrap() as z.ZodType) : s);

export const FirmFileSchema = z.strictObject({
  ...Object.fromEntries(FIRM_PROJECT_FIELDS.filter((k) => k in shape).map((k) => [k, unwrap(shape[k]!).optional()])),
  /** where issued revisions live, relative to this file (default archive/ beside it) */
  archive: word('a folder, relative to packsmith.yaml, e.g. archive').optional(),
  /** the firm's public key for verify: a .pub file written by `packsmith key create`, relative to this file */
  public_key: word('a .pub file, relative to packsmith.yaml').optional(),
});
export type FirmFile = z.output<typeof FirmFileSchema>;
