// Changes since the previous revision, computed from data.json as written and read back.
import { afterAll, describe, expect, it } from 'vitest';
import { copyFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadJob } from '../../src/job.js';
import { dataBytes, packData, parseData, type PackData, type RevisionInfo } from '../../src/archive/data.js';
import { diffData } from '../../src/archive/diff.js';
import { copyFixture, edit, removeTree } from '../helpers/archive.js';

const REV1: RevisionInfo = { number: 1, date: '2026-10-10', by: 'T. Marwood', reason: null };
const made: string[] = [];

/** The fixture job, optionally edited, as its data.json would read back. */
function data(change: (dir: string) => void = () => {}, revision: RevisionInfo | null = null): PackData {
  const dir = copyFixture('archive-job');
  made.push(join(dir, '..', '..'));
  change(dir);
  const job = loadJob(dir);
  if (!job.ok) throw new Error(job.errors.map((e) => `${e.file}:${e.row}:${e.column}: ${e.message}`).join('\n'));
  const parsed = parseData(dataBytes(packData(job.project, job.assessment, '0.0.0-test', revision)));
  if (!parsed.ok) throw new Error(parsed.why);
  return parsed.data;
}

const before = data(() => {}, REV1) as PackData & { revision: RevisionInfo };
const diff = (next: PackData) => diffData(before, next, null);
const count = (c: ReturnType<typeof diff>) =>
  c.circuitsAdded.length + c.circuitsRemoved.length + c.design.length + c.readings.length + c.verdicts.length + c.job.length;

afterAll(() => made.forEach(removeTree));

describe('test sessions recorded after a revision but dated before it', () => {
  it('are accepted and listed, while a later session is not', () => {
    const late = diff(data((d) => copyFileSync(join(d, 'readings/2026-10-09.csv'), join(d, 'readings/2026-10-08-found.csv'))));
    expect(late.lateSessions).toEqual([{ file: 'readings/2026-10-08-found.csv', date: '2026-10-08' }]);
    const sameDay = diff(data((d) => copyFileSync(join(d, 'readings/2026-10-09.csv'), join(d, 'readings/2026-10-10.csv'))));
    expect(sameDay.lateSessions).toEqual([{ file: 'readings/2026-10-10.csv', date: '2026-10-10' }]);
    const later = diff(data((d) => copyFileSync(join(d, 'readings/2026-10-09.csv'), join(d, 'readings/2026-10-11.csv'))));
    expect(later.lateSessions).toEqual([]);
  });
});

describe('changes since the previous revision', () => {
  it('finds nothing when nothing changed, and names the revision compared with', () => {
    const c = diff(data());
    expect(c.since).toEqual({ revision: 1, date: '2026-10-10' });
    expect(count(c)).toBe(0);
  });

  it('lists one changed reading, old and new with their dates, and nothing else', () => {
    const c = diff(data((d) => edit(d, 'readings/2026-10-09.csv', 'ok,1.08,', 'ok,1.12,')));
    expect(c.readings).toEqual([{ board: 'DB1', ref: '1', field: 'zs_ohm', before: '1.08 Ω on 2026-10-09', after: '1.12 Ω on 2026-10-09' }]);
    expect(count(c)).toBe(1);
  });

  it('lists a re-test in a later session, and the verdict it changed', () => {
    const c = diff(data((d) => writeFileSync(join(d, 'readings/2026-10-12-retest.csv'), 'board,ref,polarity,tested_by\nDB1,2,fail,T. Marwood\n')));
    expect(c.readings).toEqual([{ board: 'DB1', ref: '2', field: 'polarity', before: 'ok on 2026-10-09', after: 'fail on 2026-10-12' }]);
    expect(c.verdicts).toEqual([{ board: 'DB1', ref: '2', check: 'polarity', before: 'pass', after: 'fail' }]);
    expect(count(c)).toBe(2);
  });

  it('lists circuits added and removed', () => {
    const c = diff(data((d) => {
      edit(d, 'circuits.csv', 'DB1,3,Dust extractor,motor,8,mcb:C,16,2.5,1.5,12,C,,,6,12000,\n', 'DB1,4,Yard floodlight,lighting,1.2,mcb:B,6,1.5,1.0,30,C,,,6,5000,\n');
      edit(d, 'readings/2026-10-09.csv', 'DB1,3,0.21,>999,250,500,ok,0.58,,,,T. Marwood\n', '');
    }));
    expect(c.circuitsAdded).toEqual([{ board: 'DB1', ref: '4', description: 'Yard floodlight' }]);
    expect(c.circuitsRemoved).toEqual([{ board: 'DB1', ref: '3', description: 'Dust extractor' }]);
    expect(c.readings).toEqual([]);
    expect(c.verdicts).toEqual([]);
  });

  it('lists design data and job details that changed', () => {
    const c = diff(data((d) => {
      edit(d, 'circuits.csv', 'rcbo:B,20,2.5,1.5,16,C', 'rcbo:B,20,2.5,1.5,18,C');
      edit(d, 'project.yaml', 'ze_ohm: 0.35', 'ze_ohm: 0.30');
    }));
    expect(c.design).toEqual([{ board: 'DB1', ref: '2', field: 'length_m', before: '16', after: '18' }]);
    expect(c.job).toEqual([{ field: 'supply.ze_ohm', before: '0.35', after: '0.3' }]);
    expect(c.readings).toEqual([]);
  });
});
