// `packsmith check` in the terminal: by default a line per circuit (its worst status and the
// checks still open, by name) and then every open item in full; with --explain the working of
// every check. What it must print is the brief of the pack's plain-words work (issue 13, point 8).
import { describe, expect, it } from 'vitest';
import { loadJob } from '../../src/job.js';
import type { Assessment, Status } from '../../src/calc/types.js';
import { checkLabel, plainWords } from '../../src/render/labels.js';
import { assessmentText } from '../../src/render/text.js';

const JOBS = ['projects/heronsgate-pottery', 'projects/tannery-row-refit', 'projects/marsh-street-surgery', 'tests/fixtures/failing-job'];
const loaded = JOBS.map((dir) => {
  const j = loadJob(dir);
  if (!j.ok) throw new Error(`${dir} invalid`);
  return j.assessment;
});
const OPEN: Status[] = ['fail', 'not-verified', 'attention'];
const flat = (s: string) => s.replace(/\s+/g, ' ');
const circuitLines = (a: Assessment, text: string) => text.split('\n').filter((l) => a.circuits.some((c) => l.startsWith(`${c.board} ${c.ref} `)));

describe('check in the terminal', () => {
  it('prints one line per circuit, with its worst status and every open check named', () => {
    for (const a of loaded) {
      const text = assessmentText(a);
      const lines = circuitLines(a, text);
      expect(lines, a.job).toHaveLength(a.circuits.length);
      a.circuits.forEach((c, i) => {
        const line = lines[i]!;
        expect(line.startsWith(`${c.board} ${c.ref} `), line).toBe(true);
        const statuses = c.checks.map((k) => k.status);
        // the worst by the order fail, not verified, attention, pass, n/a
        const worst = (['fail', 'not-verified', 'attention', 'pass', 'n/a'] as Status[]).find((s) => statuses.includes(s))!;
        expect(line, `${a.job} ${c.board} ${c.ref}`).toContain(worst === 'not-verified' ? 'not verified' : worst);
        for (const k of c.checks.filter((x) => OPEN.includes(x.status))) expect(line).toContain(checkLabel(k.id));
      });
    }
  });

  it('prints every open item in full, and no passing check\'s working unless asked', () => {
    for (const a of loaded) {
      const text = flat(assessmentText(a));
      for (const c of a.circuits) {
        for (const k of c.checks) {
          const basis = flat(plainWords(k.basis));
          if (OPEN.includes(k.status)) expect(text, `${a.job} ${c.board} ${c.ref} ${k.id}`).toContain(basis);
          else if (k.status === 'pass' && basis.length > 40) expect(text, `${a.job} ${c.board} ${c.ref} ${k.id}`).not.toContain(basis);
        }
      }
    }
  });

  it('prints the working of every check with --explain', () => {
    for (const a of loaded) {
      const text = flat(assessmentText(a, { explain: true }));
      for (const c of a.circuits) for (const k of c.checks) expect(text, `${a.job} ${c.board} ${c.ref} ${k.id}`).toContain(flat(plainWords(k.basis)));
    }
  });

  it('wraps the working to the width asked for; only a circuit\'s own line may run longer', () => {
    for (const a of loaded) {
      const text = assessmentText(a, { width: 100 });
      const own = new Set(circuitLines(a, text));
      // the first line names the rule set; a single word longer than the width cannot be wrapped
      const long = text.split('\n').slice(1).filter((l) => l.length > 100 && !own.has(l) && /\s\S+\s/.test(l.trim()));
      expect(long, a.job).toEqual([]);
    }
  });
});
