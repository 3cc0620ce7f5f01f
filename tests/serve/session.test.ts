// Recording a test session: which readings a circuit is asked for, how the new file is named and
// written, and that it is refused with the very messages `check` gives.
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { copyFixture } from '../helpers/archive.js';
import { fieldsFor, newLabel, saveSession, sessionCsv, type SessionInput } from '../../src/serve/session.js';
import { loadJob } from '../../src/job.js';
import { run } from '../helpers/cli.js';
import { readJob } from '../../src/load/job.js';

const input = (values: Record<string, Record<string, string>>, extra: Partial<SessionInput> = {}): SessionInput => ({
  date: '2026-03-20', label: '', testedBy: 'R. Okafor', values: new Map(Object.entries(values)), ...extra,
});

describe('the readings a circuit is asked for', () => {
  const names = (c: { ring: boolean; rcd_ma?: number }) => fieldsFor(c).map((f) => f.name);
  it('ring end-to-end readings only for a ring; RCD times and button only where there is an RCD', async () => {
    expect(names({ ring: false })).not.toContain('ring_r1_ohm');
    expect(names({ ring: false })).not.toContain('rcd_1x_ms');
    expect(names({ ring: true })).toEqual(expect.arrayContaining(['ring_r1_ohm', 'ring_rn_ohm', 'ring_r2_ohm']));
    expect(names({ ring: false, rcd_ma: 30 })).toEqual(expect.arrayContaining(['rcd_1x_ms', 'rcd_5x_ms', 'rcd_button']));
    for (const c of [{ ring: false }, { ring: true, rcd_ma: 30 }]) expect(names(c)).toEqual(expect.arrayContaining(['r1r2_ohm', 'ir_le_mohm', 'zs_ohm', 'polarity']));
  });
});

describe('the name of a new session', () => {
  it('is the date alone when the day is free, else a label sorting after every session of that day', async () => {
    expect(newLabel([], '2026-03-20', '')).toBe('');
    expect(newLabel([{ date: '2026-03-20', label: '' }], '2026-03-20', '')).toBe('session-02');
    expect(newLabel([{ date: '2026-03-20', label: '' }, { date: '2026-03-20', label: 'session-02' }], '2026-03-20', '')).toBe('session-03');
    expect(newLabel([{ date: '2026-03-20', label: '' }], '2026-03-20', 'retest')).toBe('retest');
    // a wanted label that would sort before the day's later session would be superseded by it: numbered after it
    expect(newLabel([{ date: '2026-03-20', label: 'retest' }], '2026-03-20', 'afternoon')).toBe('retest-02');
    expect(newLabel([{ date: '2026-03-19', label: '' }], '2026-03-20', '')).toBe('');
  });
});

describe('saving a session', () => {
  it('writes a new file that the job reads back, and a second save the same day its own file, in force after the first', async () => {
    const job = copyFixture('pack-job');
    const first = saveSession(job, input({ 'DB-A/1': { zs_ohm: '0.71', r1r2_ohm: '0.52' } }));
    expect(first).toEqual({ ok: true, file: 'readings/2026-03-20.csv' });
    const second = saveSession(job, input({ 'DB-A/1': { zs_ohm: '0.69' } }));
    expect(second).toEqual({ ok: true, file: 'readings/2026-03-20-session-02.csv' });
    expect(readFileSync(join(job, 'readings/2026-03-20.csv'), 'utf8')).toBe('board,ref,r1r2_ohm,zs_ohm,tested_by\n"DB-A","1","0.52","0.71","R. Okafor"\n');
    const loaded = loadJob(job);
    if (!loaded.ok) throw new Error(loaded.errors[0]!.message);
    const zs = loaded.project.readings.get('DB-A/1')!.zs_ohm!;
    expect(zs.value).toEqual({ kind: 'value', value: 0.69 });
    expect(zs.earlier.map((e) => e.value)).toEqual([{ kind: 'value', value: 9.9 }, { kind: 'value', value: 0.71 }]);
    expect(readdirSync(join(job, 'readings')).filter((n) => n.startsWith('.'))).toEqual([]); // no working file left
  });

  it('never replaces a session file, even one written between the check and the write', async () => {
    const job = copyFixture('pack-job');
    writeFileSync(join(job, 'readings/2026-03-20.csv'), 'board,ref,zs_ohm\nDB-A,1,0.70\n');
    const r = saveSession(job, input({ 'DB-A/1': { zs_ohm: '0.71' } }));
    expect(r).toEqual({ ok: true, file: 'readings/2026-03-20-session-02.csv' });
    expect(readFileSync(join(job, 'readings/2026-03-20.csv'), 'utf8')).toBe('board,ref,zs_ohm\nDB-A,1,0.70\n');
  });

  it('refuses an invalid cell with the message check prints for the same file, and writes nothing', async () => {
    const job = copyFixture('pack-job');
    const r = saveSession(job, input({ 'DB-A/2': { zs_ohm: '0,62', rcd_1x_ms: '-3', polarity: 'maybe' }, 'DB-A/1': { zs_ohm: '0.7' } }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(existsSync(join(job, 'readings/2026-03-20.csv'))).toBe(false);
    // the same cells written by hand, as check reads them
    writeFileSync(join(job, 'readings/2026-03-20.csv'), sessionCsv(input({ 'DB-A/2': { zs_ohm: '0,62', rcd_1x_ms: '-3', polarity: 'maybe' }, 'DB-A/1': { zs_ohm: '0.7' } })).text);
    const check = await run(['check', job]);
    expect(check.code).toBe(2);
    for (const field of ['zs_ohm', 'rcd_1x_ms', 'polarity']) {
      const message = r.cells.get(`DB-A/2|${field}`);
      expect(message, field).toBeDefined();
      expect(check.stderr).toContain(`: ${message}`);
    }
    expect(r.cells.has('DB-A/1|zs_ohm')).toBe(false);
  });

  it('refuses a bad date or label, an empty session, and a job folder with other problems', async () => {
    const job = copyFixture('pack-job');
    const bad = saveSession(job, input({ 'DB-A/1': { zs_ohm: '0.7' } }, { date: '2026-02-30', label: '../x' }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect([...bad.session.keys()].sort()).toEqual(['date', 'label']);
    const empty = saveSession(job, input({ 'DB-A/1': { zs_ohm: '  ' } }));
    expect(empty.ok || empty.session.get('tested_by')).toMatch(/nothing entered/);
    writeFileSync(join(job, 'circuits.csv'), readFileSync(join(job, 'circuits.csv'), 'utf8').replace('mcb:C', 'mcb:Q'));
    const broken = saveSession(job, input({ 'DB-A/1': { zs_ohm: '0.7' } }));
    expect(broken.ok).toBe(false);
    if (!broken.ok) expect(broken.job.map((e) => e.file)).toContain('circuits.csv');
    expect(readJob(job).sessions).toHaveLength(1);
  });
});
