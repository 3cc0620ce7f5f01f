import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { readJob } from '../../src/load/job.js';
import { validate } from '../../src/model/validate.js';
import { formatError } from '../../src/load/raw.js';

const fixture = (name: string) => fileURLToPath(new URL(`../fixtures/${name}/`, import.meta.url));
const demo = fileURLToPath(new URL('../../projects/tannery-row-refit/', import.meta.url));

describe('validating a job folder', () => {
  const v = validate(readJob(fixture('broken-job')));
  const lines = v.ok ? [] : v.errors.map(formatError);

  it('rejects the broken job and reports every problem at once', () => {
    expect(v.ok).toBe(false);
    expect(lines.length).toBeGreaterThanOrEqual(18);
  });

  it.each([
    ['project.yaml:7:13: supply.earthing: found "TN-Z"', 'a value outside a fixed list (YAML)'],
    ['project.yaml:9:12: supply.ze_ohms: unknown field', 'a misspelled YAML field'],
    ['circuits.csv:1:12: unknown column "colour"', 'an unknown column'],
    ['circuits.csv:2:5: ib_a: found "4,2" with a decimal comma', 'a decimal comma'],
    ['circuits.csv:3:6: device: found "mcb:E"', 'an unknown device code'],
    ['circuits.csv:4:1: board "DB9" is not listed', 'an unknown board'],
    ['circuits.csv:4:10: length_m: found "12 ft": the unit "ft" does not fit', 'an unknown unit'],
    ['circuits.csv:4:11: method: found "Z"', 'an unknown reference method'],
    ['circuits.csv:5:2: circuit 1 on DB1 is listed twice', 'a duplicated circuit'],
    ['circuits.csv:5:10: length_m: found "-5"; a length in metres cannot be negative', 'a negative length'],
    ['circuits.csv:6:7: rating_a: found 25 A; fuse:bs3036 (BS 3036) is made in 5, 15, 20, 30, 45, 60, 100 A; two or three elements twisted together', 'a rating the family does not make'],
    ['readings/2026-11-13.csv:2:4: ir_le_mohm: found "250 kV"', 'a unit that does not fit the field'],
    ['readings/2026-11-13.csv:2:6: rcd_1x_ms: found "0.028", which looks like seconds', 'seconds where ms are expected'],
    ['readings/2026-11-13.csv:3:3: zs_ohm: found "-0.2"; a resistance in ohms cannot be negative', 'a negative resistance'],
    ['readings/2026-11-13.csv:3:6: rcd_1x_ms: found "28 s", a time in seconds', 'a seconds unit in an ms field'],
    ['readings/2026-11-13.csv:3:7: polarity: found "maybe"', 'a result word outside the list'],
    ['readings/2026-11-13.csv:4:2: no circuit 7 on board DB1', 'an unknown circuit ref'],
    ['readings/13-11-2026.csv:1:1: a readings file is named after its test date', 'a session file not named by date'],
  ])('reports %s (%s)', (start) => {
    expect(lines.some((l) => l.startsWith(start))).toBe(true);
  });

  it('reports a missing required column once, at the header', () => {
    const job = readJob(fixture('broken-job'));
    job.circuits!.header = job.circuits!.header.filter((h) => h.text !== 'ib_a');
    for (const r of job.circuits!.rows) delete r.cells.ib_a;
    const w = validate(job);
    const missing = w.ok ? [] : w.errors.filter((e) => e.message.includes('"ib_a"'));
    expect(missing).toHaveLength(1);
    expect(missing[0]).toMatchObject({ file: 'circuits.csv', row: 1 });
  });

  it('refuses a test session dated after today (the caller reads the clock), and accepts one dated today', () => {
    const job = readJob(fixture('archive-job')); // its one session: readings/2026-10-09.csv
    const future = validate(job, [], [], { today: '2026-10-08' });
    expect(future.ok ? [] : future.errors).toEqual([
      { file: 'readings/2026-10-09.csv', row: 1, column: 1, message: 'test session dated 2026-10-09, after today (2026-10-08); a readings file is named after the day its tests were done' },
    ]);
    expect(validate(job, [], [], { today: '2026-10-09' }).ok).toBe(true);
    expect(validate(job).ok).toBe(true); // no date given: nothing to compare with
  });

  it('reports a missing project.yaml instead of failing', () => {
    const w = validate(readJob(fixture('does-not-exist')));
    expect(w.ok).toBe(false);
  });

  it('accepts the demo job', () => {
    const d = validate(readJob(demo));
    if (!d.ok) throw new Error(d.errors.map(formatError).join('\n'));
    expect(d.project.circuits.length).toBeGreaterThanOrEqual(10);
  });
});

describe('merging test sessions', () => {
  const d = validate(readJob(demo));
  if (!d.ok) throw new Error('demo invalid');
  const signage = d.project.readings.get('DB1/10')!;

  it('lets the later session win, field by field, remembering dates and earlier values', () => {
    expect(signage.zs_ohm!.value).toEqual({ kind: 'value', value: 1.39 });
    expect(signage.zs_ohm!.date).toBe('2026-11-20');
    expect(signage.zs_ohm!.earlier).toEqual([{ value: { kind: 'value', value: 9.8 }, date: '2026-11-13', file: 'readings/2026-11-13.csv' }]);
  });

  it('reads the cellar session from the tester\'s export through readings.columns', () => {
    const cellar = d.project.readings.get('DB2/1')!;
    expect(cellar.ir_le_mohm).toMatchObject({ value: { kind: 'value', value: 1.6 }, date: '2026-11-16', file: 'readings/2026-11-16-cellar-export.csv' });
    expect(cellar.tested_by!.value).toBe('R. Okafor');
  });

  it('keeps an earlier value where the later session is silent', () => {
    const ring = d.project.readings.get('DB1/3')!;
    expect(ring.rcd_1x_ms!.date).toBe('2026-11-13');
    expect(ring.rcd_1x_ms!.earlier).toEqual([]);
  });
});
