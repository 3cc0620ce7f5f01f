// Input errors of issue 10: IT earthing refused (point 4), Cmin above 1.0 refused (point 10), a
// three-phase circuit on a single-phase supply and a device above its rated voltage (point 11).
import { describe, expect, it } from 'vitest';
import { ProjectFileSchema, CircuitSchema } from '../../src/model/schema.js';
import { phasesOnSupply, ratedVoltage } from '../../src/calc/inputs.js';
import { BASE_CIRCUIT, projectFile } from '../helpers/project.js';

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
