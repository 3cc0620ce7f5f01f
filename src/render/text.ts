// The terminal view of an assessment (`packsmith check`). By default one line per circuit (its
// worst status, the checks still open named) and then every open item in full; with `explain`,
// the working of every check. Checks and fields by their labels; long text wrapped to the width.
import type { Assessment, CheckResult, CircuitAssessment } from '../calc/types.js';
import { checkLabel, plainWords, sentence } from './labels.js';
import { OPEN, SEVERITY, STATUS_LOOK, worstStatus } from './status.js';
import { historyLine } from './values.js';

export interface TextOptions {
  /** every check's working, not only the open ones */
  explain?: boolean;
  /** wrap long lines at this many columns (default 100) */
  width?: number;
}

/** Words wrapped to `width` columns, every line after the first indented by `indent`. */
export function wrap(text: string, width: number, indent: string, first = ''): string[] {
  const lines: string[] = [];
  let line = first;
  let fresh = true;
  for (const word of text.split(/\s+/).filter(Boolean)) {
    if (!fresh && line.length + 1 + word.length > width) {
      lines.push(line);
      line = indent + word;
    } else {
      line = fresh ? line + word : `${line} ${word}`;
    }
    fresh = false;
  }
  lines.push(line);
  return lines;
}

const word = (k: Pick<CheckResult, 'status'>) => `${STATUS_LOOK[k.status].symbol} ${STATUS_LOOK[k.status].word}`;
const where = (c: CircuitAssessment) => `${c.board} ${c.ref}`;

function circuitLine(c: CircuitAssessment, refWidth: number): string {
  const worst = worstStatus(c.checks.map((k) => k.status));
  const open = c.checks.filter((k) => OPEN.includes(k.status))
    .sort((x, y) => SEVERITY.indexOf(x.status) - SEVERITY.indexOf(y.status))
    .map((k) => `${checkLabel(k.id)} (${STATUS_LOOK[k.status].word})`);
  const retested = c.checks.some((k) => k.history) ? ' (re-tested)' : '';
  return `${where(c).padEnd(refWidth)}  ${word({ status: worst }).padEnd(14)} ${c.description}${retested}${open.length ? ` — open: ${open.join(', ')}` : ''}`;
}

function checkBlock(k: CheckResult, width: number, indent: number): string[] {
  const pad = ' '.repeat(indent);
  const head = `${pad}${word(k).padEnd(14)} ${checkLabel(k.id)}: `;
  const lines = wrap(plainWords(k.basis), width, `${pad}    `, head);
  const trace = historyLine(k);
  if (trace) lines.push(...wrap(`history: ${trace}`, width, `${pad}    `, `${pad}    `));
  if (k.remedy) lines.push(...wrap(sentence(plainWords(k.remedy)), width, `${pad}    `, `${pad}    `));
  return lines;
}

export function assessmentText(a: Assessment, opts: TextOptions = {}): string {
  const width = opts.width ?? 100;
  const lines: string[] = [];
  lines.push(`${a.job}: rule set ${a.rules.set_name} (${a.rules.set}), premises ${a.rules.premises}, U0 ${a.rules.u0_v} V, Cmin ${a.rules.cmin}, measured Zs factor ${a.rules.measured_zs_factor}`);
  if (opts.explain) {
    for (const c of a.circuits) {
      lines.push('', `${where(c)}  ${c.description}`);
      for (const k of c.checks) lines.push(...checkBlock(k, width, 2));
    }
  } else {
    const refWidth = Math.max(...a.circuits.map((c) => where(c).length), 0);
    for (const c of a.circuits) lines.push(circuitLine(c, refWidth));
    const rank = (k: Pick<CheckResult, 'status'>) => SEVERITY.indexOf(k.status);
    const open = a.circuits
      .map((c) => ({ c, open: c.checks.filter((k) => OPEN.includes(k.status)).sort((x, y) => rank(x) - rank(y)) }))
      .filter((x) => x.open.length > 0)
      .sort((x, y) => rank(x.open[0]!) - rank(y.open[0]!));
    const count = open.reduce((n, x) => n + x.open.length, 0);
    if (count) {
      lines.push('', `open items (${count}), worst first:`);
      for (const { c, open: checks } of open) {
        lines.push(`  ${where(c)} ${c.description}`);
        for (const k of checks) lines.push(...checkBlock(k, width, 4));
      }
    }
  }
  for (const d of a.departures) lines.push('', ...wrap(`departure: ${plainWords(d.basis)}; circuits affected: ${d.circuits.join(', ')}`, width, '    '));
  const s = a.summary;
  lines.push('', `summary: ${s.pass} pass, ${s.fail} fail, ${s.attention} attention, ${s['not-verified']} not verified, ${s['n/a']} n/a`);
  if (!opts.explain) lines.push('the working of every check: packsmith check <job-folder> --explain');
  return `${lines.join('\n')}\n`;
}
