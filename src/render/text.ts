// The terminal view of an assessment (`packsmith check`): one block per circuit, one line per check.
import type { Assessment } from '../calc/types.js';
import { historyLine, STATUS_LOOK } from './view.js';

export function assessmentText(a: Assessment): string {
  const lines: string[] = [];
  lines.push(`${a.job}: rule set ${a.rules.set_name} (${a.rules.set}), premises ${a.rules.premises}, U0 ${a.rules.u0_v} V, Cmin ${a.rules.cmin}, measured Zs factor ${a.rules.measured_zs_factor}`);
  for (const c of a.circuits) {
    lines.push('', `${c.board} ${c.ref}  ${c.description}`);
    for (const k of c.checks) {
      const look = STATUS_LOOK[k.status];
      lines.push(`  ${look.symbol} ${look.word.padEnd(12)} ${k.id.padEnd(17)} ${k.basis}`);
      const trace = historyLine(k);
      if (trace) lines.push(`${' '.repeat(34)}${trace}`);
    }
  }
  for (const d of a.departures) lines.push('', `departure: ${d.basis}; circuits affected: ${d.circuits.join(', ')}`);
  const s = a.summary;
  lines.push('', `summary: ${s.pass} pass, ${s.fail} fail, ${s.attention} attention, ${s['not-verified']} not verified, ${s['n/a']} n/a`);
  return `${lines.join('\n')}\n`;
}
