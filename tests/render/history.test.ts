// A re-tested check as the pack says it, from the demo job's re-test of the window signage.
import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { readJob } from '../../src/load/job.js';
import { validate } from '../../src/model/validate.js';
import { assess } from '../../src/calc/assess.js';
import { historyLine } from '../../src/render/view.js';
import { renderPack } from '../../src/render/pack.js';

const demo = fileURLToPath(new URL('../../projects/tannery-row-refit/', import.meta.url));

describe('re-tests in the pack', () => {
  const v = validate(readJob(demo));
  if (!v.ok) throw new Error('demo invalid');
  const a = assess(v.project);
  const signage = a.circuits.find((c) => c.board === 'DB1' && c.ref === '10')!;
  const zs = signage.checks.find((k) => k.id === 'zs-measured')!;

  it('keeps the failed first test and the passing re-test of measured Zs', () => {
    // B6 at 0.4 s: 0.8 × 230 × 0.95 / 30 = 5.83 Ω (IEC 60898-1 band, 0.8 common practice)
    expect(zs.history).toEqual([
      { date: '2026-11-13', value: 9.8, status: 'fail' },
      { date: '2026-11-20', value: 1.39, status: 'pass' },
    ]);
    expect(historyLine(zs)).toBe('9.8 Ω on 2026-11-13 (fail), re-tested 1.39 Ω on 2026-11-20 (pass)');
  });
  it('marks an over-range value with ">"', () => {
    const ir = signage.checks.find((k) => k.id === 'insulation')!;
    expect(historyLine(ir)).toBe('>999 MΩ on 2026-11-13 (pass), re-tested >999 MΩ on 2026-11-20 (pass)');
  });
  it('gives no line to a circuit tested once', () => {
    const once = a.circuits.find((c) => c.board === 'DB1' && c.ref === '1')!;
    expect(once.checks.every((k) => historyLine(k) === null)).toBe(true);
  });
  it('prints the trace in the measured results of the pack', () => {
    const html = renderPack(v.project, a, { revisionLabel: 'DRAFT', draft: true, date: '2026-11-20' });
    // under the circuit's measured Zs in the appendix
    expect(html).toContain('<span class="history">9.8 Ω on 2026-11-13 (fail), re-tested 1.39 Ω on 2026-11-20 (pass)</span>');
  });
});
