// A bounded fuzz of the demo jobs (the harness says what it checks); `npm run fuzz` runs the long
// campaign (FUZZ_CASES, default 20,000) and prints its counts.
import { describe, expect, it } from 'vitest';
import { base, CUT_ROW, FAILING_SESSION, fuzz, JOBS, runCase, setCell } from './harness.js';

const total = Number(process.env.FUZZ_CASES ?? 240);
const seed = Number(process.env.FUZZ_SEED ?? 11);

describe(`fuzzing the demo jobs (${total} cases)`, () => {
  it('never crashes, always locates a refusal, and never passes what the plain value does not', () => {
    const systematic = Math.round(total * 0.45);
    // the long run (npm run fuzz) also counts a case over 10 s as a hang; the suite keeps no timings
    const clock = process.env.FUZZ_CASES ? { now: () => performance.now(), hangMs: 10_000 } : {};
    const c = fuzz({ systematic, random: total - systematic, seed, ...clock });
    const line = `fuzz: ${c.cases} cases (${c.systematic} systematic, ${c.random} random; seed ${seed}): ${c.valid} valid, ${c.refused} refused, ${c.crashes} crashes, ${c.hangs} hangs, ${c.unlocated} unlocated refusals, ${c.wrongPasses} wrong passes`;
    console.log(line);
    for (const e of c.examples) console.log(`  ${e}`);
    expect(c.cases).toBe(total);
    expect(c.examples).toEqual([]);
    expect({ crashes: c.crashes, unlocated: c.unlocated, wrongPasses: c.wrongPasses }).toEqual({ crashes: 0, unlocated: 0, wrongPasses: 0 });
  }, Math.max(60_000, total * 1000));
});

describe('the fuzz oracle', () => {
  it('refuses a cut row of the failing session, which would otherwise let earlier passes through', () => {
    const b = base(JOBS[0]!);
    const cell = b.cells.find((c) => c.file === FAILING_SESSION && c.field === 'zs_ohm')!;
    const text = setCell(b.texts.get(FAILING_SESSION)!, cell.line, cell.col, CUT_ROW);
    expect(runCase(b, FAILING_SESSION, Buffer.from(text), cell).kind).toBe('refused');
  });
});
