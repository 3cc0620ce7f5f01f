// Firm settings (`packsmith.yaml`): what is the same for every job of a firm, read from the
// nearest packsmith.yaml above a job folder and merged under the job's project.yaml (a data
// cascade: the job wins field by field, objects merge key by key, lists are replaced whole).
// Every merged value keeps the file, row and column it came from.
//
// The search starts at the folder holding the job folder and goes up, one folder at a time, to
// the first folder that is a repository root (holds `.git`) or to the filesystem root; the
// nearest packsmith.yaml wins. A folder's own packsmith.yaml is looked for before it is taken
// as the repository root, so one at the top of a repository of jobs is found.
import { existsSync, statSync } from 'node:fs';
import { basename, dirname, isAbsolute, join, relative, resolve } from 'node:path';
import { readConfined } from './confine.js';
import { readYaml } from './yaml.js';
import type { LocatedError, RawYaml, SourcePosition } from './raw.js';

export const FIRM_FILE = 'packsmith.yaml';

/** The project.yaml fields a firm file may set for all its jobs (the model drops any it does not know yet). */
export const FIRM_PROJECT_FIELDS = ['installer', 'theme', 'paper', 'rules', 'signoff', 'readings', 'circuits', 'premises'] as const;

export interface Firm {
  /** absolute path of the packsmith.yaml */
  path: string;
  /** the folder holding it */
  dir: string;
  /** its path as errors name it: relative to the job folder, e.g. ../packsmith.yaml */
  file: string;
  bytes: Buffer;
  /** the parsed document (null when it cannot be read as YAML; see errors) */
  doc: RawYaml | null;
  errors: LocatedError[];
}

const isFile = (p: string): boolean => existsSync(p) && statSync(p).isFile();

/** The packsmith.yaml that applies to a job folder, or null when there is none. */
export const findFirmFile = (jobDir: string): string | null => firmFileFrom(dirname(resolve(jobDir)));

/** The nearest packsmith.yaml in `start` or above it, up to a repository root, or null. */
export function firmFileFrom(start: string): string | null {
  let dir = resolve(start);
  for (;;) {
    const candidate = join(dir, FIRM_FILE);
    if (isFile(candidate)) return candidate;
    const up = dirname(dir);
    if (up === dir || existsSync(join(dir, '.git'))) return null;
    dir = up;
  }
}

const text = (v: unknown): string | null => (typeof v === 'string' && v.trim() !== '' ? v.trim() : null);

/** The firm settings that apply to a job folder, or null when there is no firm file. */
export function readFirm(jobDir: string): Firm | null {
  const path = findFirmFile(jobDir);
  return path === null ? null : readFirmFile(path, relative(resolve(jobDir), path));
}

/**
 * A firm file's bytes, read only where it really lies in its own folder: a link to a file
 * elsewhere is refused (throws), never followed, like every file packsmith reads.
 */
export function firmFileBytes(path: string): Buffer {
  const abs = resolve(path);
  const bytes = readConfined(dirname(abs), basename(abs), "the firm file's folder");
  if (bytes === null) throw new Error(`${basename(abs)}: no such file`);
  return bytes;
}

/** One firm file, read: `shownAs` is the name errors give it (default: its path as given). */
export function readFirmFile(path: string, shownAs = path): Firm {
  const abs = resolve(path);
  const dir = dirname(abs);
  let bytes: Buffer;
  try {
    bytes = firmFileBytes(abs);
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    return { path: abs, dir, file: shownAs, bytes: Buffer.alloc(0), doc: null, errors: [{ file: shownAs, row: 1, column: 1, message: `cannot read the firm file: ${why}` }] };
  }
  const { doc, errors } = readYaml(shownAs, bytes.toString('utf8'));
  // where issued revisions live and the firm's public key are the archive's to read (archive/location.ts)
  return { path: abs, dir, file: shownAs, bytes, doc, errors };
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** `over` laid on `under`: objects merge key by key, anything else in `over` replaces. */
export function deepMerge(under: unknown, over: unknown): unknown {
  if (over === undefined) return under;
  if (!isObject(under) || !isObject(over)) return over;
  const out: Record<string, unknown> = { ...under };
  for (const [k, v] of Object.entries(over)) out[k] = deepMerge(under[k], v);
  return out;
}

/** Whether `path` leads to a value in `data`. */
function has(data: unknown, path: readonly PropertyKey[]): boolean {
  let node = data;
  for (const key of path) {
    if (Array.isArray(node) && typeof key === 'number') node = node[key];
    else if (isObject(node) && typeof key === 'string' && key in node) node = node[key];
    else return false;
  }
  return true;
}

/**
 * The job's project.yaml with the firm's settings beneath it. A value the job gives is located in
 * project.yaml; one only the firm gives, in the firm file. The firm's `theme` (relative to the firm
 * file) is rewritten relative to the job folder, as a job's own theme is.
 */
export function withFirm(project: RawYaml, firm: Firm, jobDir: string): RawYaml {
  const given = firm.doc?.data;
  if (!isObject(given)) return project;
  const picked: Record<string, unknown> = {};
  for (const k of FIRM_PROJECT_FIELDS) if (k in given) picked[k] = given[k];
  const theme = text(picked.theme);
  if (theme !== null) {
    const abs = isAbsolute(theme) ? theme : resolve(firm.dir, theme);
    picked.theme = relative(resolve(jobDir), abs) || '.';
  }
  const firmDoc = firm.doc!;
  return {
    file: project.file,
    data: deepMerge(picked, project.data ?? {}),
    positionOf(path): SourcePosition {
      if (has(project.data, path)) return project.positionOf(path);
      if (has(picked, path)) return firmDoc.positionOf(path);
      return project.positionOf(path);
    },
  };
}
