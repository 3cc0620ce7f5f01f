// Input errors of issue 10: IT earthing refused (point 4), Cmin above 1.0 refused (point 10), a
// three-phase circuit on a single-phase supply and a device above its rated voltage (point 11).
import { describe, expect, it } from 'vitest';
import { ProjectFileSchema, CircuitSchema } from '../../src/model/schema.js';
import { phasesOnSupply, ratedVoltage, rcdRating } from '../../src/calc/inputs.js';
import { BASE_CIRCUIT, projectFile } from '../helpers/project.js';
import { demoCopy, errorsOf, replaceIn } from '../helpers/job.js';

const yaml = (over: Record<string, unknown>) => ProjectFileSchema.safeParse({
  title: 'T', client: { name: 'C' }, site: { address: 'S' }, installer: { firm: 'F' },
  supply: { earthing: 'TN-S' }, boards: [{ id: 'DB1' }], ...over,
});
const circuit = (c: Record<string, string>) => CircuitSchema.parse({ ...BASE_CIRCUIT, ref: '1', ...c });

describe('IT earthing is refused until its rules are built (IEC 60364-4-41, 411.6)', () => {
  it('is an input error naming the reason, never assessed as TN', () => {
    const r = yaml({ supply: { earthing: 'IT' } });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.message).toMatch(/IT systems are not assessed/);
    expect(r.error!.issues[0]!.path).toEqual(['supply', 'earthing']);
  });
});

describe('Cmin above 1.0 (IEC 60909-0 Table 1: Cmin 0.95 for LV)', () => {
  it('is an input error; 1.0 and below are read', () => {
    expect(yaml({ rules: { cmin: 1.05 } }).success).toBe(false);
    expect(yaml({ rules: { cmin: 1.0 } }).success).toBe(true);
  });
});

describe('consistency of circuits.csv with project.yaml', () => {
  it('a three-phase circuit on a single-phase supply is an input error', () => {
    const single = projectFile({ supply: { earthing: 'TN-S', phases: 1 } });
    expect(phasesOnSupply(circuit({ phases: '3' }), single)).toMatchObject({ field: 'phases' });
    expect(phasesOnSupply(circuit({ phases: '3' }), projectFile({ supply: { earthing: 'TN-S', phases: 3 } }))).toBeNull();
  });
  it('a device above its rated voltage is an input error: BS 3036 (240 V to earth) at U0 400 V, BS 88-3 (240 V) three-phase', () => {
    const f400 = projectFile({ supply: { earthing: 'TN-S', u0_v: 400, phases: 3 } });
    expect(ratedVoltage(circuit({ device: 'fuse:bs3036', rating_a: '30' }), f400)).toMatchObject({ field: 'device' });
    const f230 = projectFile({ supply: { earthing: 'TN-S', u0_v: 230, phases: 3 } });
    expect(ratedVoltage(circuit({ device: 'fuse:bs88-3', rating_a: '32', phases: '3' }), f230)).toMatchObject({ field: 'device' }); // 398 V between lines
    expect(ratedVoltage(circuit({ device: 'mcb:B', phases: '3' }), f230)).toBeNull(); // IEC 60898-1: up to 440 V
    expect(ratedVoltage(circuit({ device: 'fuse:bs3036', rating_a: '30' }), f230)).toBeNull();
  });
});

describe('an RCBO without its residual current rating', () => {
  // IEC 61009-1: an RCBO is a residual current device with overcurrent protection; its RCD element
  // is tested like any RCD (IEC 60364-6, 6.4.3.8), which needs its IΔn
  it('is an input error on rcd_ma; with a rating, or for an MCB, it is not', () => {
    expect(rcdRating(circuit({ device: 'rcbo:B' }), null)).toMatchObject({ field: 'rcd_ma', message: expect.stringMatching(/rcbo:B is an RCBO/) });
    expect(rcdRating(circuit({ device: 'rcbo:B', rcd_ma: '30' }), null)).toBeNull();
    expect(rcdRating(circuit({ device: 'mcb:B' }), null)).toBeNull();
  });
});

describe('the same input errors through the job loader, located in the file to correct', () => {
  it('a three-phase circuit on a single-phase supply, a BS 88-3 fuse between lines, IT earthing and Cmin 1.05', () => {
    const single = demoCopy();
    replaceIn(single, 'project.yaml', 'phases: 3', 'phases: 1');
    // DB1/6, the three-phase roaster, is on row 7 of circuits.csv
    expect(errorsOf(single)).toEqual(expect.arrayContaining([expect.stringMatching(/circuits\.csv:7:.*three-phase circuit; project\.yaml gives a single-phase supply/)]));
    const between = demoCopy();
    replaceIn(between, 'circuits.csv', 'DB2,2,Cellar chiller,power,8,fuse:bs88-3,20,2.5,1.5,10,C,1,', 'DB2,2,Cellar chiller,power,8,fuse:bs88-3,20,2.5,1.5,10,C,3,');
    expect(errorsOf(between)).toEqual([expect.stringMatching(/circuits\.csv:14:.*fuse:bs88-3 is rated up to 240 V.*398 V between lines/)]);
    const isolated = demoCopy();
    replaceIn(isolated, 'project.yaml', 'earthing: TN-C-S', 'earthing: IT');
    expect(errorsOf(isolated)).toEqual([expect.stringMatching(/project\.yaml:\d+:.*IT systems are not assessed/)]);
    const cmin = demoCopy();
    replaceIn(cmin, 'project.yaml', 'rules:\n', 'rules:\n  cmin: 1.05\n');
    expect(errorsOf(cmin)).toEqual([expect.stringMatching(/project\.yaml:\d+:.*Cmin above 1\.0/)]);
  });
});
