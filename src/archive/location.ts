// Where a job's issued revisions live, and the firm's public key: the two settings of the firm
// file (packsmith.yaml, the nearest one in the folder that holds the job folders or above it)
// that the archive needs. Issued revisions go to `archive:` (relative to the firm file), else to
// archive/ beside the folder that holds the job folders (projects/<job> → archive/<job>/rev-N/),
// never under the drafts' --out. The firm file is found and read as for the job's other firm
// settings (load/firm.ts), so the archive and the pack always follow the same file.
import { dirname, join, resolve } from 'node:path';
import { FIRM_FILE, firmFileFrom, readFirmFile } from '../load/firm.js';
import type { LocatedError } from '../load/raw.js';

export const DEFAULT_ARCHIVE = 'archive';

export interface ArchiveSettings {
  /** the firm file read, or null when there is none */
  firmFile: string | null;
  /** absolute path of the archive folder (holding <job>/rev-N/) */
  archive: string;
  /** absolute path of the firm's public key file, or null */
  publicKey: string | null;
  errors: LocatedError[];
}

function setting(data: unknown, key: string): unknown {
  return data !== null && typeof data === 'object' && !Array.isArray(data) ? (data as Record<string, unknown>)[key] : undefined;
}

/**
 * The archive settings for the job folders held by `holder` (e.g. projects/). `override` (an
 * --archive option) wins over the firm file.
 */
export function archiveSettings(holder: string, override: string | null = null): ArchiveSettings {
  const firmFile = firmFileFrom(holder);
  const fallback = join(dirname(resolve(holder)), DEFAULT_ARCHIVE);
  const settings: ArchiveSettings = { firmFile, archive: override ? resolve(override) : fallback, publicKey: null, errors: [] };
  if (!firmFile) return settings;
  const { doc, errors } = readFirmFile(firmFile);
  if (!doc) return { ...settings, errors };
  const base = dirname(firmFile);
  for (const key of ['archive', 'public_key'] as const) {
    const v = setting(doc.data, key);
    if (v === undefined || v === null) continue;
    if (typeof v !== 'string' || v.trim() === '') {
      settings.errors.push({ ...doc.positionOf([key]), file: firmFile, message: `${key}: expected a path relative to ${FIRM_FILE}` });
      continue;
    }
    if (key === 'archive' && !override) settings.archive = resolve(base, v.trim());
    if (key === 'public_key') settings.publicKey = resolve(base, v.trim());
  }
  return settings;
}

/** The archive settings of one job folder (its holder is the folder it stands in). */
export const jobArchiveSettings = (jobDir: string, override: string | null = null): ArchiveSettings =>
  archiveSettings(dirname(resolve(jobDir)), override);
