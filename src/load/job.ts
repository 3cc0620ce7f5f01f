// Read a job folder (CONTRACT.md): project.yaml, circuits.csv, readings/*.csv, notes.md.
// The only stage besides archive that touches the file system.
import { readdirSync, readFileSync, existsSync, statSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { readCsv } from './csv.js';
import { readYaml } from './yaml.js';
import { readFirm, withFirm } from './firm.js';
import type { LocatedError, RawJob, RawSession } from './raw.js';

const SESSION_NAME = /^(\d{4}-\d{2}-\d{2})(?:-([A-Za-z0-9][A-Za-z0-9_-]*))?\.csv$/;

const isDirectory = (p: string): boolean => existsSync(p) && statSync(p).isDirectory();

export function readJob(dir: string): RawJob {
  const root = resolve(dir);
  const errors: LocatedError[] = [];
  const files = new Map<string, Buffer>();
  const job: RawJob = { name: basename(root), dir: root, project: null, firm: null, circuits: null, sessions: [], notes: null, files, errors };

  if (!existsSync(root) || !statSync(root).isDirectory()) {
    errors.push({ file: dir, row: 1, column: 1, message: 'no job folder here; expected a folder holding project.yaml and circuits.csv' });
    return job;
  }
  const read = (rel: string): string | null => {
    const path = join(root, rel);
    if (!existsSync(path)) return null;
    const bytes = readFileSync(path);
    files.set(rel, bytes);
    return bytes.toString('utf8');
  };

  const projectText = read('project.yaml');
  if (projectText === null) {
    errors.push({ file: 'project.yaml', row: 1, column: 1, message: 'file missing; every job needs a project.yaml (title, client, site, supply, boards)' });
  } else {
    const { doc: own, errors: e } = readYaml('project.yaml', projectText);
    errors.push(...e);
    // the firm's settings beneath the job's own; the firm file is an input like the job's files
    const firm = readFirm(root);
    job.firm = firm;
    if (firm) {
      files.set(firm.file, firm.bytes);
      errors.push(...firm.errors);
    }
    const doc = own && firm?.doc ? withFirm(own, firm, root) : own;
    job.project = doc;
    const theme = (doc?.data as { theme?: unknown } | null)?.theme;
    if (doc && typeof theme === 'string' && theme.trim() !== '' && !isDirectory(resolve(root, theme.trim()))) {
      const at = doc.positionOf(['theme']);
      errors.push({ ...at, message: `theme: no folder "${theme}" (looked in ${resolve(root, theme.trim())}); expected a theme folder, relative to ${at.file === 'project.yaml' ? 'the job folder' : 'the folder of the firm file'}` });
    }
  }

  const circuitsText = read('circuits.csv');
  if (circuitsText === null) {
    errors.push({ file: 'circuits.csv', row: 1, column: 1, message: 'file missing; every job needs a circuits.csv with one row per circuit' });
  } else {
    const { table, errors: e } = readCsv('circuits.csv', circuitsText);
    job.circuits = table;
    errors.push(...e);
  }

  const readingsDir = join(root, 'readings');
  if (existsSync(readingsDir)) {
    const names = readdirSync(readingsDir).filter((n) => n.toLowerCase().endsWith('.csv')).sort();
    const sessions: RawSession[] = [];
    for (const name of names) {
      const rel = `readings/${name}`;
      const m = SESSION_NAME.exec(name);
      const text = read(rel) ?? '';
      if (!m || Number.isNaN(Date.parse(m[1]!))) {
        errors.push({ file: rel, row: 1, column: 1, message: 'a readings file is named after its test date: YYYY-MM-DD.csv or YYYY-MM-DD-label.csv' });
        continue;
      }
      const { table, errors: e } = readCsv(rel, text);
      errors.push(...e);
      sessions.push({ date: m[1]!, label: m[2] ?? '', table });
    }
    // Date order; on one date, the unlabelled session first, then labels in name order.
    sessions.sort((a, b) => (a.date === b.date ? a.label.localeCompare(b.label) : a.date < b.date ? -1 : 1));
    job.sessions = sessions;
  }

  const notes = read('notes.md');
  if (notes !== null) job.notes = { file: 'notes.md', text: notes };
  return job;
}
