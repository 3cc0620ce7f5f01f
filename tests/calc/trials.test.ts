// Trials in numbers only: the longest run tries each circuit at dozens of lengths and reads only
// each check's status, value and limit, so there the basis lines are left unformed (calc/basis.ts).
// That is sound only if no check judges by its words: here every check is run on circuits of
// every kind of protection, at lengths from 0.5 m to 5 km, with and without words, and must give
// the same status, value and limit; and no assessment may carry an unformed line.
import { describe, expect, it } from 'vitest';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { atLength } from '../../src/calc/assess.js';
import { numbersOnly, said, UNFORMED } from '../../src/calc/basis.js';
import { CHECKS } from '../../src/calc/checks/index.js';
import { loadJob } from '../../src/job.js';
import { context } from '../helpers/context.js';
import { ROOT } from '../helpers/cli.js';

const CIRCUITS: [string, Record<string, string>, Record<string, unknown>][] = [
  ['mcb:B 32 A radial', {}, { ze_ohm: '0.35', pfc_ka: '1.5' }],
  ['mcb:C 32 A ring', { device: 'mcb:C', ring: 'yes' }, { ze_ohm: '0.35', pfc_ka: '1.5' }],
  ['mcb:D 16 A on 4/2.5 mm²', { device: 'mcb:D', rating_a: '16', ib_a: '9', live_mm2: '4', cpc_mm2: '2.5' }, { ze_ohm: '0.2', pfc_ka: '6' }],
  ['gG 32 A, separate 1 mm² cpc, maker let-through', { device: 'fuse:gG', ib_a: '25', live_mm2: '6', cpc_mm2: '1', cpc_in_cable: 'no', let_through_a2s: '9000' }, { ze_ohm: '0.35', pfc_ka: '1.5' }],
  ['BS 3036 30 A', { device: 'fuse:bs3036', rating_a: '30', ib_a: '13', live_mm2: '4' }, { ze_ohm: '0.8' }],
  ['rcbo:B 20 A on TT', { device: 'rcbo:B', rating_a: '20', ib_a: '14', rcd_ma: '30', rcd_type: 'A' }, { earthing: 'TT', ze_ohm: '21' }],
  ['BS 88-3 by the maker\'s Ia', { device: 'fuse:bs88-3', rating_a: '30', ib_a: '20', device_ia_a: '200' }, { ze_ohm: '0.35' }],
  ['three-phase 16 mm²', { phases: '3', live_mm2: '16', cpc_mm2: '16', rating_a: '63', ib_a: '50', device: 'mcb:C' }, { ze_ohm: '0.1', pfc_ka: '10', phases: 3 }],
  ['no Ze', {}, {}],
];
const LENGTHS = [0.5, 1.7, 6, 20, 48.3, 150, 700, 5000];

describe('a trial in numbers only judges as the checks do with their words', () => {
  for (const [what, circuit, supply] of CIRCUITS) {
    it(what, () => {
      const ctx = context(circuit, { zs_ohm: '0.9', r1r2_ohm: '0.4' }, supply);
      for (const l of LENGTHS) {
        const worded = atLength(ctx, l);
        const bare = numbersOnly(() => atLength(ctx, l));
        for (const [id, check] of CHECKS) {
          const a = check(worded);
          const b = numbersOnly(() => check(bare));
          expect({ id: b.id, status: b.status, value: b.value, limit: b.limit }, `${id} at ${l} m`).toEqual({ id: a.id, status: a.status, value: a.value, limit: a.limit });
          expect(a.basis).not.toContain(UNFORMED);
        }
      }
    });
  }
  it('leaves a line unformed only within numbersOnly', () => {
    let formed = 0;
    const words = () => { formed += 1; return 'the words'; };
    expect(numbersOnly(() => said(words))).toBe(UNFORMED);
    expect(formed).toBe(0);
    expect(said(words)).toBe('the words');
    expect(() => numbersOnly(() => { throw new Error('x'); })).toThrow('x');
    expect(said(words)).toBe('the words'); // a throw inside does not leave the words off
  });
});

describe('no assessment carries an unformed line', () => {
  const jobs = [
    ...readdirSync(join(ROOT, 'projects')).map((j) => join(ROOT, 'projects', j)),
    ...['tree-three-level', 'tt-instrument-job', 'failing-job', 'worked-example', 'long-board'].map((j) => join(ROOT, 'tests/fixtures', j)),
  ];
  for (const dir of jobs) {
    it(dir.slice(ROOT.length).replace(/^\//, ''), () => {
      const job = loadJob(dir, { today: '2099-01-01' });
      if (!job.ok) throw new Error(job.errors[0]!.message);
      expect(JSON.stringify(job.assessment)).not.toContain(UNFORMED);
    });
  }
});
