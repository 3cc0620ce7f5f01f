// Read a job folder (CONTRACT.md): project.yaml, circuits.csv, readings/*.csv, notes.md.
// The only stage besides archive that touches the file system. Reads are confined to the job
// folder (confine.ts), text must be UTF-8 (text.ts), and every file in readings/ must be a
// readings CSV: a file that would be skipped is an error, never a silently missing session.
import { existsSync, lstatSync, readdirSync, statSync } from 'node:fs';
import { basename, dirname, join, relative, resolve } from 'node:path';
import { readCsv } from './csv.js';
import { readYaml } from './yaml.js';
import { confinedTo, isInside, realFolder } from './confine.js';
import { decodeText } from './text.js';
import { isCalendarDate } from './date.js';
import { findFirmFile, firmFileBytes, readFirm, withFirm } from './firm.js';
import type { LocatedError, RawJob, RawSession } from './raw.js';

/** A readings file's name: its test date and an optional label. */
export const SESSION_NAME = /^(\d{4}-\d{2}-\d{2})(?:-([A-Za-z0-9][A-Za-z0-9_-]*))?\.csv$/i;

/** The order of test sessions: by date; on one date, the unlabelled session first, then labels in name order. */
export const sessionOrder = (a: { date: string; label: string }, b: { date: string; label: string }): number =>
  a.date === b.date ? a.label.localeCompare(b.label) : a.date < b.date ? -1 : 1;
const JOB_FOLDER = 'the job folder';

const isDirectory = (p: string): boolean => existsSync(p) && statSync(p).isDirectory();

/**
 * The folder a job may name paths in (its theme): the folder above the one that holds the job
 * folders (`<firm>/projects/<job>` → `<firm>`), or a folder higher up that holds a firm file
 * (packsmith.yaml). Paths outside it are given on the command line only.
 */
export function firmFolder(jobDir: string): string {
  const fallback = dirname(dirname(realFolder(jobDir)));
  for (let d = dirname(fallback); d !== dirname(d); d = dirname(d)) {
    if (existsSync(join(d, 'packsmith.yaml'))) return d;
  }
  return fallback;
}

/** Why a name in readings/ is not a test session, and what to do. */
function notASession(name: string, folder: boolean): string {
  const lower = name.toLowerCase();
  const rename = 'a readings file is named after its test date: YYYY-MM-DD.csv or YYYY-MM-DD-label.csv';
  if (folder) return `a folder inside readings/; ${rename}, directly in readings/: move the folder out`;
  const dated = SESSION_NAME.exec(name);
  if (dated && !isCalendarDate(dated[1]!)) return `${dated[1]} is not a day of the calendar; ${rename}`;
  if (lower.startsWith('.~lock.') || lower.startsWith('~$')) return 'a lock file left by a spreadsheet program that has a readings file open; close the spreadsheet (or delete this file) and run again';
  if (/\.(xlsx|xlsm|xls|ods|numbers)$/.test(lower)) return `a spreadsheet workbook, which packsmith does not read; save the sheet as CSV ("CSV UTF-8") as ${lower.replace(/\.[a-z]+$/, '.csv')} and move this file out of readings/`;
  if (/\.csv\.[a-z0-9]+$/.test(lower) || lower.endsWith('.txt')) return `not named .csv (a program may have added "${name.slice(name.toLowerCase().lastIndexOf('.'))}"); rename it so it ends in .csv: ${rename}`;
  if (lower.endsWith('.csv')) return rename;
  return `not a readings file; readings/ holds only test sessions: ${rename}; move this file elsewhere`;
}

export function readJob(dir: string): RawJob {
  const root = resolve(dir);
  const errors: LocatedError[] = [];
  const files = new Map<string, Buffer>();
  const job: RawJob = { name: basename(root), dir: root, project: null, firm: null, circuits: null, sessions: [], notes: null, files, errors };

  if (!existsSync(root) || !statSync(root).isDirectory()) {
    errors.push({ file: dir, row: 1, column: 1, message: 'no job folder here; expected a folder holding project.yaml and circuits.csv' });
    return job;
  }
  const inJob = confinedTo(root, JOB_FOLDER);
  /** The text of a file of the job, null when missing, undefined when refused (an error, reported here). */
  const read = (rel: string): string | null | undefined => {
    let bytes: Buffer | null;
    try {
      bytes = inJob.read(rel);
    } catch (e) {
      errors.push({ file: rel, row: 1, column: 1, message: (e as Error).message.slice(rel.length + 2) });
      return undefined;
    }
    if (bytes === null) return null;
    files.set(rel, bytes);
    const { text, error } = decodeText(rel, bytes);
    if (error) errors.push(error);
    return text;
  };

  const projectText = read('project.yaml');
  if (projectText === null) {
    errors.push({ file: 'project.yaml', row: 1, column: 1, message: 'file missing; every job needs a project.yaml (title, client, site, supply, boards)' });
  } else if (projectText !== undefined) {
    const { doc: own, errors: e } = readYaml('project.yaml', projectText);
    for (const x of e) errors.push(x);
    // the firm's settings beneath the job's own; the firm file is an input like the job's files
    const firmFile = readFirm(root);
    job.firm = firmFile;
    if (firmFile) {
      files.set(firmFile.file, firmFile.bytes);
      for (const x of firmFile.errors) errors.push(x);
    }
    const doc = own && firmFile?.doc ? withFirm(own, firmFile, root) : own;
    job.project = doc;
    const theme = (doc?.data as { theme?: unknown } | null)?.theme;
    if (doc && typeof theme === 'string' && theme.trim() !== '') {
      const path = resolve(root, theme.trim());
      const firm = firmFolder(root);
      const at = doc.positionOf(['theme']);
      if (!isDirectory(path)) {
        errors.push({ ...at, message: `theme: no folder "${theme}" (looked in ${path}); expected a theme folder, relative to ${at.file === 'project.yaml' ? 'the job folder' : 'the folder of the firm file'}` });
      } else if (!isInside(realFolder(firm), realFolder(path))) {
        errors.push({ ...at, message: `theme: "${theme}" is outside ${firm}, the firm's folder that holds the jobs; a job names a theme inside it (a theme elsewhere is given on the command line: --theme DIR)` });
      }
    }
  }

  const circuitsText = read('circuits.csv');
  if (circuitsText === null) {
    errors.push({ file: 'circuits.csv', row: 1, column: 1, message: 'file missing; every job needs a circuits.csv with one row per circuit' });
  } else if (circuitsText !== undefined) {
    const { table, errors: e } = readCsv('circuits.csv', circuitsText);
    job.circuits = table;
    for (const x of e) errors.push(x);
  }

  const readingsFolder = inJob.folder('readings');
  if (readingsFolder.kind === 'refused') {
    errors.push({ file: 'readings', row: 1, column: 1, message: `readings: ${readingsFolder.message}; readings/ is a folder holding one CSV file per test session` });
  } else if (readingsFolder.kind === 'folder') {
    const readingsDir = readingsFolder.path;
    const sessions: RawSession[] = [];
    for (const name of readdirSync(readingsDir).sort()) {
      const rel = `readings/${name}`;
      const m = SESSION_NAME.exec(name);
      let folder = false;
      try {
        folder = lstatSync(join(readingsDir, name)).isDirectory();
      } catch { /* vanished: reported by the read below */ }
      if (folder || !m || !isCalendarDate(m[1]!)) {
        errors.push({ file: rel, row: 1, column: 1, message: notASession(name, folder) });
        continue;
      }
      const text = read(rel);
      if (text === undefined) continue;
      const { table, errors: e } = readCsv(rel, text ?? '');
      for (const x of e) errors.push(x);
      const label = m[2] ?? '';
      // 2026-11-20.csv and 2026-11-20.CSV (or -Retest and -retest) are one session twice: which
      // came first cannot be told, so neither may silently win
      const twin = sessions.find((s) => s.date === m[1] && s.label.toLowerCase() === label.toLowerCase());
      if (twin) {
        errors.push({ file: rel, row: 1, column: 1, message: `the same session as ${twin.table.file} (the same date and label, told apart only by capital letters), so which came first cannot be told; join the two into one file, or label the later one, e.g. ${m[1]}-retest.csv` });
        continue;
      }
      sessions.push({ date: m[1]!, label, table });
    }
    sessions.sort(sessionOrder);
    job.sessions = sessions;
  }

  const notes = read('notes.md');
  if (notes !== null && notes !== undefined) job.notes = { file: 'notes.md', text: notes };
  return job;
}

/** The firm file that applies to a job folder and its bytes, read confined to its folder (throws where refused); null: none. */
export type FirmBytes = (jobDir: string) => { path: string; bytes: Buffer } | null;

export const firmBytesOf: FirmBytes = (jobDir) => {
  const path = findFirmFile(jobDir);
  return path === null ? null : { path, bytes: firmFileBytes(path) };
};

/**
 * The bytes of every file a job's inputs may come from, read as readJob reads them but not
 * parsed: project.yaml, circuits.csv, notes.md, everything in readings/ and the firm file. For a
 * job that readJob finds valid, these are exactly its input files, so their hash is its input hash:
 * the build's quick look at whether a job changed since its draft. null where a file is refused
 * (the firm file too: read confined to its own folder, as readJob reads it).
 */
export function jobInputFiles(dir: string, firmOf: FirmBytes = firmBytesOf): Map<string, Buffer> | null {
  const root = resolve(dir);
  const inJob = confinedTo(root, JOB_FOLDER);
  const files = new Map<string, Buffer>();
  const take = (rel: string) => {
    const bytes = inJob.read(rel);
    if (bytes !== null) files.set(rel, bytes);
  };
  try {
    ['project.yaml', 'circuits.csv', 'notes.md'].forEach(take);
    const readings = inJob.folder('readings');
    if (readings.kind === 'refused') return null;
    if (readings.kind === 'folder') readdirSync(readings.path).forEach((name) => take(`readings/${name}`));
    const firm = firmOf(root);
    if (firm !== null) files.set(relative(root, firm.path), firm.bytes);
  } catch {
    return null;
  }
  return files;
}
