// The fuzzing harness: mutate the demo jobs and check, for every mutation, that
//   - no exception escapes reading, validating and assessing (a crash);
//   - every refusal is located (file:row:column with a known file, row and column >= 1);
//   - no check that was not `pass` becomes `pass` unless the mutated value, written plainly in
//     place of the mutated cell (and nothing else changed), gives that same assessment: a wrong
//     pass is a pass the plain writing of the value does not explain (a lost cell, a swallowed
//     row, a misread number).
// The demo jobs are read once; a mutation re-reads only the file it changes (in memory).
import fc from 'fast-check';
import { fileURLToPath } from 'node:url';
import { readJob } from '../../src/load/job.js';
import { readCsv } from '../../src/load/csv.js';
import { readYaml } from '../../src/load/yaml.js';
import { decodeText } from '../../src/load/text.js';
import type { LocatedError, RawJob } from '../../src/load/raw.js';
import { validate } from '../../src/model/validate.js';
import { assess } from '../../src/calc/assess.js';
import { CALC_RULES } from '../../src/calc/inputs.js';
import { MEASURED } from '../../src/model/schema.js';
import type { Reading } from '../../src/model/units.js';
import { plainText } from '../../src/load/number.js';

export const JOBS = ['tannery-row-refit', 'marsh-street-surgery'].map((j) => fileURLToPath(new URL(`../../projects/${j}/`, import.meta.url)));

/** What a cell may be turned into: number forms, structure breakers, encodings, extremes. */
export const CORRUPTIONS: readonly string[] = [
  '1e-3', '6.90e-3', '.690', '6.', '0', '-0', '1e-400', '1e309', '-1', '+1', '0x10', 'Infinity', 'NaN', '', ' ', '0,5',
  '1,2', '"', '""', '"x', 'x"', '"1\n2"', '\n', '\r', ';', '\t', '>', '>0', '>1e309', '>-1', '<0.5', '0.5.5', '1 1', '١', '０.５',
  '0.0000001', '99999999999999999999', '2000.01', '0.009', '250 kV', '250000', '1 kΩ', '5 MΩ', '1 GΩ', '0.5 s', '0.5 mΩ', 'n/a',
  'not-tested', 'NT', 'na', 'ok', 'fail', '\u0000', '\uFFFD', '\u00e8', '0.84 Ω', '0.84ohm', '=1+1', '@SUM(A1)', '1e3',
  '"0.5', '0.5"', '"0.5\n', '\u0001cut the row here', '\u0001drop this cell',
];

interface Cell { file: string; line: number; col: number; field: string }

export interface Base {
  dir: string;
  raw: RawJob;
  texts: Map<string, string>;
  statuses: Map<string, string>;
  cells: Cell[];
}

const statusMap = (a: ReturnType<typeof assess>): Map<string, string> =>
  new Map(a.circuits.flatMap((c) => c.checks.map((k) => [`${c.board}\u0000${c.ref}\u0000${k.id}`, k.status] as const)));

/**
 * A later test session in which every circuit of the first session failed (in memory only), so
 * that a mutation losing one of its cells — a cut row, a swallowed line — would let the earlier,
 * passing value through: the kind of wrong pass the fuzz must catch.
 */
export const FAILING_SESSION = 'readings/2099-12-31-fuzz.csv';

function withFailingSession(raw: RawJob): RawJob {
  const first = raw.sessions[0]!;
  const circuits = first.table.rows.map((r) => `${r.cells.board?.text ?? r.cells.Board?.text},${r.cells.ref?.text ?? r.cells.Circuit?.text}`);
  const text = `board,ref,zs_ohm,ir_ll_mohm,ir_le_mohm,ir_test_v,polarity,notes\n${circuits.map((c) => `${c},45,0.4,0.4,500,fail,re-test failed`).join('\n')}\n`;
  const { table } = readCsv(FAILING_SESSION, text);
  const files = new Map(raw.files);
  files.set(FAILING_SESSION, Buffer.from(text));
  return { ...raw, files, sessions: [...raw.sessions, { date: '2099-12-31', label: 'fuzz', table }] };
}

export function base(dir: string): Base {
  const raw = withFailingSession(readJob(dir));
  const v = validate(raw, CALC_RULES);
  if (!v.ok) throw new Error(`the demo job ${dir} does not validate`);
  const texts = new Map([...raw.files].map(([k, b]) => [k, b.toString('utf8')]));
  const cells: Cell[] = [];
  for (const s of raw.sessions) {
    const lines = texts.get(s.table.file)!.split('\n');
    const header = lines[0]!.split(',');
    // a measured column, by packsmith's name or an instrument's (the tannery cellar export)
    const measured = (h: string) => (h in MEASURED ? h : (Object.entries(v.project.file.readings.columns).find(([k]) => k === h)?.[1] ?? ''));
    lines.forEach((line, i) => {
      if (i === 0 || line.trim() === '') return;
      line.split(',').forEach((_, c) => {
        const field = measured(header[c]!.trim());
        if (field in MEASURED) cells.push({ file: s.table.file, line: i + 1, col: c + 1, field });
      });
    });
  }
  return { dir, raw, texts, statuses: statusMap(assess(v.project)), cells };
}

/** The job with one file's text replaced, re-read in memory as readJob would read it. */
export function withFile(b: Base, file: string, bytes: Uint8Array): RawJob {
  const errors: LocatedError[] = b.raw.errors.filter((e) => e.file !== file);
  const { text, error } = decodeText(file, bytes);
  if (error) errors.push(error);
  const files = new Map(b.raw.files);
  files.set(file, Buffer.from(bytes));
  const job: RawJob = { ...b.raw, files, errors };
  if (file === 'project.yaml') {
    const { doc, errors: e } = readYaml(file, text);
    for (const x of e) errors.push(x);
    job.project = doc;
  } else if (file === 'circuits.csv') {
    const { table, errors: e } = readCsv(file, text);
    for (const x of e) errors.push(x);
    job.circuits = table;
  } else if (file === 'notes.md') {
    job.notes = { file, text };
  } else {
    const { table, errors: e } = readCsv(file, text);
    for (const x of e) errors.push(x);
    job.sessions = b.raw.sessions.map((s) => (s.table.file === file ? { ...s, table } : s));
  }
  return job;
}

/** Corruptions of a row's structure rather than a cell's text. */
export const CUT_ROW = '\u0001cut the row here';
export const DROP_CELL = '\u0001drop this cell';

export function setCell(text: string, line: number, col: number, value: string): string {
  const lines = text.split('\n');
  let cells = lines[line - 1]!.split(',');
  if (value === CUT_ROW) cells = cells.slice(0, col - 1);
  else if (value === DROP_CELL) cells.splice(col - 1, 1);
  else cells[col - 1] = value;
  lines[line - 1] = cells.join(',');
  return lines.join('\n');
}

const plain = (r: Reading | undefined): string =>
  r === undefined ? '' : r.kind === 'n/a' ? 'n/a' : r.kind === 'not-tested' ? 'not-tested' : `${r.kind === 'at-least' ? '>' : ''}${plainText(r.value)}`;

export interface Outcome { kind: 'valid' | 'refused' | 'crash' | 'unlocated' | 'wrong-pass'; detail?: string }

const located = (e: LocatedError, files: ReadonlySet<string>): boolean =>
  files.has(e.file) && Number.isInteger(e.row) && e.row >= 1 && Number.isInteger(e.column) && e.column >= 1 && e.message.trim() !== '';

/** Run one mutation: `file` given as `bytes`; `cell` the reading cell it targets, if it targets one. */
export function runCase(b: Base, file: string, bytes: Uint8Array, cell: Cell | null): Outcome {
  try {
    const v = validate(withFile(b, file, bytes), CALC_RULES);
    if (!v.ok) {
      const files = new Set(b.raw.files.keys());
      const bad = v.errors.find((e) => !located(e, files));
      return bad ? { kind: 'unlocated', detail: JSON.stringify(bad) } : { kind: 'refused' };
    }
    const mutated = statusMap(assess(v.project));
    const flips = [...mutated].filter(([k, s]) => s === 'pass' && b.statuses.get(k) !== 'pass');
    if (flips.length === 0) return { kind: 'valid' };
    if (!cell) return explainedPlainly(b, file, v.project.rows, flips.map(([k]) => k));
    // the value as read, written plainly in place of the cell, nothing else changed
    const row = v.project.rows.find((r) => r.file === file && r.row === cell.line);
    const value = row?.values[cell.field as keyof typeof row.values] as Reading | undefined;
    const plainText_ = setCell(b.texts.get(file)!, cell.line, cell.col, plain(value));
    const p = validate(withFile(b, file, Buffer.from(plainText_)), CALC_RULES);
    if (!p.ok) return { kind: 'wrong-pass', detail: `${cell.file}:${cell.line}:${cell.col} read as "${plain(value)}", which is refused when written plainly: ${p.errors[0]?.message}` };
    const explained = statusMap(assess(p.project));
    const wrong = flips.filter(([k]) => explained.get(k) !== 'pass');
    return wrong.length === 0 ? { kind: 'valid' } : { kind: 'wrong-pass', detail: `${cell.file}:${cell.line}:${cell.col} → ${wrong.map(([k]) => k.replace(/\u0000/g, '/')).join(', ')} pass, but not when "${plain(value)}" is written plainly` };
  } catch (e) {
    return { kind: 'crash', detail: e instanceof Error ? `${e.message}\n${e.stack}` : String(e) };
  }
}

const csvCell = (s: string): string => (/[",\r\n;\t]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

/**
 * A mutation of a whole readings file: the rows as read, written out plainly (packsmith's column
 * names, every value in the plain grammar), must give the same passes. A mutation of another file
 * is judged for crashes and locations only (its design values have no plain oracle here).
 */
function explainedPlainly(b: Base, file: string, rows: { file: string; values: Record<string, unknown> }[], flips: string[]): Outcome {
  if (!file.startsWith('readings/')) return { kind: 'valid' };
  const own = rows.filter((r) => r.file === file);
  const fields = [...new Set(own.flatMap((r) => Object.keys(r.values).filter((k) => r.values[k] !== undefined)))];
  const header = ['board', 'ref', ...fields.filter((f) => f !== 'board' && f !== 'ref')];
  const text = [header.join(','), ...own.map((r) => header.map((h) => {
    const v = r.values[h];
    return csvCell(v === undefined ? '' : typeof v === 'string' ? v : plain(v as Reading));
  }).join(','))].join('\n');
  const p = validate(withFile(b, file, Buffer.from(`${text}\n`)), CALC_RULES);
  if (!p.ok) return { kind: 'wrong-pass', detail: `${file} as read is refused when written plainly: ${p.errors[0]?.message}` };
  const explained = statusMap(assess(p.project));
  const wrong = flips.filter((k) => explained.get(k) !== 'pass');
  return wrong.length === 0 ? { kind: 'valid' } : { kind: 'wrong-pass', detail: `${file} → ${wrong.map((k) => k.replace(/\u0000/g, '/')).join(', ')} pass, but not with the rows as read written plainly` };
}

export interface Counts { cases: number; systematic: number; random: number; valid: number; refused: number; crashes: number; unlocated: number; wrongPasses: number; hangs: number; examples: string[] }

/** A random mutation: a cell replaced by hostile text, or a file's bytes cut, spliced or flipped. */
const mutation = (b: Base) => {
  const files = [...b.texts.keys()];
  const hostile = fc.oneof(
    fc.constantFrom(...CORRUPTIONS),
    fc.constantFrom(CUT_ROW, DROP_CELL, '"', '"x', '"0.5\n'),
    fc.stringMatching(/^[0-9.,;"\t\n>eE+\- a-zA-ZΩµ]{0,8}$/),
    fc.tuple(fc.constantFrom(...CORRUPTIONS), fc.constantFrom(...CORRUPTIONS)).map(([a, c]) => a + c),
  );
  const cellCase = fc.record({ kind: fc.constant('cell' as const), cell: fc.constantFrom(...b.cells), text: hostile });
  const byteCase = fc.record({
    kind: fc.constant('bytes' as const),
    file: fc.constantFrom(...files),
    at: fc.nat(),
    cut: fc.nat({ max: 40 }),
    insert: fc.oneof(fc.uint8Array({ maxLength: 6 }), hostile.map((s) => new TextEncoder().encode(s))),
  });
  return fc.oneof({ arbitrary: cellCase, weight: 3 }, { arbitrary: byteCase, weight: 1 });
};

/** Run `systematic` cell × corruption cases (in order, cycling) and `random` generated ones. */
export function fuzz(opts: { systematic: number; random: number; seed: number; now?: () => number; hangMs?: number }): Counts {
  const bases = JOBS.map(base);
  const counts: Counts = { cases: 0, systematic: 0, random: 0, valid: 0, refused: 0, crashes: 0, unlocated: 0, wrongPasses: 0, hangs: 0, examples: [] };
  const record = (o: Outcome, ms: number) => {
    counts.cases += 1;
    if (opts.hangMs !== undefined && ms > opts.hangMs) {
      counts.hangs += 1;
      if (counts.examples.length < 20) counts.examples.push(`hang: ${ms} ms`);
    }
    if (o.kind === 'valid') counts.valid += 1;
    else if (o.kind === 'refused') counts.refused += 1;
    else {
      if (o.kind === 'crash') counts.crashes += 1;
      if (o.kind === 'unlocated') counts.unlocated += 1;
      if (o.kind === 'wrong-pass') counts.wrongPasses += 1;
      if (counts.examples.length < 20) counts.examples.push(`${o.kind}: ${o.detail}`);
    }
  };
  const now = opts.now ?? (() => 0);
  const grid = bases.flatMap((b) => b.cells.flatMap((cell) => CORRUPTIONS.map((text) => ({ b, cell, text }))));
  for (let i = 0; i < opts.systematic; i++) {
    // a stride through the grid, so a short run still visits many cells and corruptions
    const { b, cell, text } = grid[(i * 7919) % grid.length]!;
    const t = now();
    record(runCase(b, cell.file, Buffer.from(setCell(b.texts.get(cell.file)!, cell.line, cell.col, text)), cell), now() - t);
    counts.systematic += 1;
  }
  const perBase = Math.ceil(opts.random / bases.length);
  bases.forEach((b, n) => {
    const todo = Math.min(perBase, opts.random - n * perBase);
    if (todo <= 0) return;
    for (const m of fc.sample(mutation(b), { numRuns: todo, seed: opts.seed + n })) {
      const t = now();
      if (m.kind === 'cell') {
        record(runCase(b, m.cell.file, Buffer.from(setCell(b.texts.get(m.cell.file)!, m.cell.line, m.cell.col, m.text)), m.cell), now() - t);
      } else {
        const bytes = Buffer.from(b.texts.get(m.file)!);
        const at = bytes.length === 0 ? 0 : m.at % bytes.length;
        const out = Buffer.concat([bytes.subarray(0, at), Buffer.from(m.insert), bytes.subarray(Math.min(bytes.length, at + m.cut))]);
        record(runCase(b, m.file, out, null), now() - t);
      }
      counts.random += 1;
    }
  });
  return counts;
}

/** The total of systematic cases: every numeric reading cell of the demo jobs × every corruption. */
export const gridSize = (): number => JOBS.map(base).reduce((n, b) => n + b.cells.length * CORRUPTIONS.length, 0);
