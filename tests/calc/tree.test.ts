// The installation as a tree of boards: values carried down from the origin, worked by hand.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { loadJob } from '../../src/job.js';
import { formatError } from '../../src/load/raw.js';
import { assess } from '../../src/calc/assess.js';
import { carry } from '../../src/calc/tree/carry.js';
import { boardQuery } from '../../src/calc/tree/query.js';
import { boardOrder, parseFeed, treeProblems } from '../../src/calc/tree/build.js';
import { largestOnBoards } from '../../src/calc/tree/site.js';
import { resolveRules } from '../../src/calc/rules.js';
import { CircuitSchema, ProjectFileSchema } from '../../src/model/schema.js';
import type { Project } from '../../src/model/validate.js';
import type { Assessment } from '../../src/calc/types.js';

function assessed(dir: string): Assessment {
  const job = loadJob(dir);
  if (!job.ok) throw new Error(job.errors.map(formatError).join('\n'));
  return job.assessment;
}
const circuit = (a: Assessment, key: string) => a.circuits.find((c) => `${c.board}/${c.ref}` === key)!;
const check = (a: Assessment, key: string, id: string) => circuit(a, key).checks.find((k) => k.id === id)!;
const board = (a: Assessment, id: string) => a.boards!.find((b) => b.board === id)!;

// Conductor resistances at 20 °C, mΩ/m, copper: IEC 60228 Table 2 (16 mm² 1.15, 10 mm² 1.83,
// 6 mm² 3.08, 2.5 mm² 7.41, 1.5 mm² 12.1, 1 mm² 18.1). Temperature coefficient 0.00393 /K
// (IEC 60287-1-1 Table 1); PVC conductors at 70 °C in service (IEC 60364-5-52 Table 52.1):
// R(70 °C) = R20 × (1 + 0.00393 × 50) = R20 × 1.1965.
const HOT = 1 + 0.00393 * 50;

describe('two levels, worked by hand (tests/fixtures/tree-two-level)', () => {
  // Supply TN-C-S, U0 230 V, Ze 0.35 Ω, 1.5 kA at the origin. DB1/1: gG 63 A, 16/10 mm² PVC, 40 m,
  // Ib 50 A, feeding DB2. DB2/1: mcb:B 20 A, 2.5/1.5 mm² PVC, 25 m, Ib 16 A.
  const a = assessed('tests/fixtures/tree-two-level');
  const feederR1R2 = (40 * (1.15 + 1.83) * HOT) / 1000; // 0.142623 Ω
  const zdb2 = 0.35 + feederR1R2; // 0.492623 Ω
  const finalR1R2 = (25 * (7.41 + 12.1) * HOT) / 1000; // 0.583593 Ω

  it('Zdb at DB2 is Ze + the sub-main\'s R1+R2 at 70 °C: 0.35 + 0.1426 = 0.4926 Ω', () => {
    expect(zdb2).toBeCloseTo(0.492623, 6);
    expect(board(a, 'DB2').zdb.derived).toBeCloseTo(zdb2, 9);
    expect(circuit(a, 'DB2/1').derived.zdb_ohm).toBe(0.493);
  });
  it('the fault current at DB2 adds line and neutral at 20 °C to the origin loop: 230 / (230/1500 + 2 × 40 × 1.15 mΩ) = 937.5 A', () => {
    const expected = 230 / (230 / 1500 + (2 * 40 * 1.15) / 1000); // 937.50 A
    expect(board(a, 'DB2').pfc.derived! * 1000).toBeCloseTo(expected, 6);
    expect(circuit(a, 'DB2/1').derived.fault_current_max_a).toBe(938);
  });
  it('design Zs of DB2/1 starts from the derived Zdb: 0.4926 + 0.5836 = 1.0762 Ω ≤ 230 × 0.95 / (5 × 20 A) = 2.185 Ω', () => {
    // max Zs: type B trips within 0.1 s at 5 In (IEC 60898-1); Cmin 0.95 (CENELEC TR 50480)
    const k = check(a, 'DB2/1', 'zs-design');
    expect(k.value).toBeCloseTo(zdb2 + finalR1R2, 3);
    expect(k.limit).toBeCloseTo((230 * 0.95) / 100, 3);
    expect(k.status).toBe('pass');
  });
  it('voltage drop is counted from the origin: 2.393 % (sub-main) + 3.084 % = 5.477 % > 5 % (IEC 60364-5-52 Table G.52.1)', () => {
    const feeder = (2 * 40 * 1.15 * HOT * 50) / 1000 / 230 * 100; // 2.3930 %
    const own = (2 * 25 * 7.41 * HOT * 16) / 1000 / 230 * 100; // 3.0838 %
    expect(feeder).toBeCloseTo(2.393, 3);
    expect(own).toBeCloseTo(3.0838, 4);
    const k = check(a, 'DB2/1', 'voltage-drop');
    expect(k.value).toBeCloseTo(feeder + own, 2);
    expect(k.status).toBe('fail');
    expect(k.basis).toContain('DB1/1 2.39 % + this circuit 3.08 % = 5.48 % from the origin');
    expect(circuit(a, 'DB2/1').derived.vd_origin_percent).toBeCloseTo(5.48, 2);
  });
  it('the longest run is where the drop from the origin reaches 5 %: (5 − 2.393) % × 230 V / (2 × 8.866 mΩ/m × 16 A) = 21.1 m', () => {
    const feeder = (2 * 40 * 1.15 * HOT * 50) / 1000 / 230 * 100;
    const perMetre = (2 * 7.41 * HOT * 16) / 1000; // V/m
    const byDrop = ((5 - feeder) / 100 * 230) / perMetre; // 21.13 m
    const byZs = ((230 * 0.95) / 100 - zdb2) / (finalR1R2 / 25); // 72.5 m: design Zs is not the limit
    expect(byZs).toBeGreaterThan(byDrop);
    expect(circuit(a, 'DB2/1').derived.max_length_m).toBe(Math.floor(byDrop * 10) / 10);
    expect(check(a, 'DB2/1', 'voltage-drop').remedy).toBe('would pass with a run of at most 21.1 m (now 25 m), or 4 mm² live conductors (now 2.5 mm²)');
    expect(circuit(a, 'DB2/1').max_length_basis).toBe('21.1 m, set by voltage drop from the origin');
  });
  it('the sub-main\'s own longest run: (5 − 0) % × 230 V / (2 × 1.376 mΩ/m × 50 A) = 83.5 m, well under where design Zs would stop it', () => {
    const perMetre = (2 * 1.15 * HOT * 50) / 1000; // V/m, 16 mm² at 70 °C, Ib 50 A
    const byDrop = (0.05 * 230) / perMetre; // 83.57 m
    // gG 63 A at 5 s: Ia 320 A, the IEC 60269-1 gate Imax(5 s) (src/reference/fuses-iec-60269.ts, from memory)
    const byZs = ((230 * 0.95) / 320 - 0.35) / (feederR1R2 / 40); // 94.9 m
    expect(byZs).toBeGreaterThan(byDrop);
    expect(circuit(a, 'DB1/1').derived.max_length_m).toBe(Math.floor(byDrop * 10) / 10);
    expect(circuit(a, 'DB1/1').max_length_basis).toBe('83.5 m, set by voltage drop from the origin (its own checks only: a longer run also raises Zdb and the drop at DB2, whose circuits are not judged again here)');
  });
  it('the sub-main is a distribution circuit: 5 s on TN (IEC 60364-4-41, 411.3.2.3)', () => {
    expect(circuit(a, 'DB1/1').derived.required_disconnect_s).toBe(5);
    expect(circuit(a, 'DB2/1').derived.required_disconnect_s).toBe(0.4); // Table 41.1, TN, 230 V
  });
  it('selectivity: gG 63 A over mcb:B 20 A overlaps from 450 A, below the 937.5 A at DB2', () => {
    // gG 63 A may melt within 0.1 s from 450 A (IEC 60269-1 gate Imin(0.1 s), in
    // src/reference/fuses-iec-60269.ts), where mcb:B 20 A need only trip within 0.1 s (5 In = 100 A,
    // IEC 60898-1): the bands meet at 450 A.
    const k = check(a, 'DB1/1', 'selectivity');
    expect(k.status).toBe('attention');
    expect(k.value).toBe(450);
    expect(k.basis).toContain('overlap from 450 A');
    expect(check(a, 'DB2/1', 'selectivity').status).toBe('n/a');
  });
});

describe('the feeding circuit, judged as a distribution circuit', () => {
  const twoBoards = (supply: Record<string, string>, feeder: Record<string, string> = {}): Project => {
    const file = ProjectFileSchema.parse({
      title: 't', client: { name: 'c' }, site: { address: 'a' }, installer: { firm: 'f' }, supply,
      boards: [{ id: 'DB1' }, { id: 'DB2', fed_by: 'DB1/1' }],
    });
    const row = (n: number, c: Record<string, string>) => ({ ...CircuitSchema.parse({ kind: 'power', method: 'C', description: 'd', ...c }), row: n });
    const circuits = [
      row(2, { board: 'DB1', ref: '1', kind: 'other', ib_a: '50', device: 'fuse:gG', rating_a: '63', live_mm2: '16', cpc_mm2: '10', length_m: '40', ...feeder }),
      row(3, { board: 'DB2', ref: '1', ib_a: '16', device: 'mcb:B', rating_a: '20', live_mm2: '2.5', cpc_mm2: '1.5', length_m: '25' }),
      row(4, { board: 'DB2', ref: '2', ib_a: '6', device: 'mcb:B', rating_a: '10', live_mm2: '1.5', cpc_mm2: '1.5', length_m: '25', kind: 'lighting' }),
    ];
    return { name: 'p', file, circuits, readings: new Map(), rows: [], sessions: [], notes: null };
  };
  it('1 s on TT (IEC 60364-4-41, 411.3.2.4), and the time the job sets for it where it sets one', () => {
    const tt = assess(twoBoards({ earthing: 'TT', ze_ohm: '20', pfc_ka: '0.5' }));
    expect(circuit(tt, 'DB1/1').derived.required_disconnect_s).toBe(1);
    const set = assess(twoBoards({ earthing: 'TN-C-S', ze_ohm: '0.35', pfc_ka: '1.5' }, { disconnect_s: '0.4' }));
    expect(circuit(set, 'DB1/1').derived.required_disconnect_s).toBe(0.4);
  });
  it('runs its own design checks as for any circuit', () => {
    const a = assess(twoBoards({ earthing: 'TN-C-S', ze_ohm: '0.35', pfc_ka: '1.5' }));
    for (const id of ['overload', 'voltage-drop', 'zs-design', 'disconnection', 'adiabatic', 'breaking-capacity']) {
      expect(check(a, 'DB1/1', id).status, id).not.toBe('n/a');
    }
    // overload: Ib 50 ≤ In 63 ≤ Iz 85 A (IEC 60364-5-52 Table B.52.2, method C, 16 mm², PVC, 2 loaded)
    expect(check(a, 'DB1/1', 'overload').limit).toBe(85);
  });
  it('selectivity passes where the fault current at the fed board stays below where the bands meet: 230 / (230/500 + 2 × 40 × 1.15 mΩ) = 416.7 A < 450 A', () => {
    // gG 63 A may melt within 0.1 s only from 450 A (IEC 60269-1 gate Imin(0.1 s)); mcb:B 20 A,
    // the largest device on DB2, trips within 0.1 s from 5 In = 100 A (IEC 60898-1)
    const upto = 230 / (230 / 500 + (2 * 40 * 1.15) / 1000);
    expect(upto).toBeCloseTo(416.7, 1);
    const a = assess(twoBoards({ earthing: 'TN-C-S', ze_ohm: '0.35', pfc_ka: '0.5' }));
    const k = check(a, 'DB1/1', 'selectivity');
    expect(k.status).toBe('pass');
    expect(k.value).toBe(417);
    expect(k.basis).toContain('mcb:B 20 A (DB2/1, the largest device on DB2)');
    expect(check(a, 'DB2/1', 'selectivity').status).toBe('n/a');
  });
});

describe('three levels (tests/fixtures/tree-three-level)', () => {
  // DB1 → DB1/1 (16/10 mm², 40 m) → DB2 (Zdb measured 0.47 Ω) → DB2/2 (6/6 mm², 20 m, Ib 25 A) → DB3.
  const a = assessed('tests/fixtures/tree-three-level');
  const zdb2 = 0.35 + (40 * (1.15 + 1.83) * HOT) / 1000; // 0.492623 Ω derived
  const zdb3 = zdb2 + (20 * (3.08 + 3.08) * HOT) / 1000; // + 0.147409 = 0.640032 Ω

  it('keeps measured and derived Zdb side by side; design takes the larger, measured checks the measured', () => {
    const b2 = board(a, 'DB2');
    expect(b2.zdb.measured).toBe(0.47);
    expect(b2.zdb.derived).toBeCloseTo(zdb2, 9);
    expect(b2.zdb.design).toBeCloseTo(zdb2, 9);
    expect(b2.zdb.test).toBe(0.47);
  });
  it('carries Zdb down two feeding circuits: 0.4926 + 0.1474 = 0.6400 Ω at DB3', () => {
    expect(board(a, 'DB3').zdb.derived).toBeCloseTo(zdb3, 9);
    const lights = (15 * (18.1 + 18.1) * HOT) / 1000; // 1 mm² lighting circuit, 15 m
    expect(check(a, 'DB3/1', 'zs-design').value).toBeCloseTo(zdb3 + lights, 3);
  });
  it('adds both feeding circuits\' drops: 2.393 + 1.602 + 0.847 = 4.843 % > 3 % for lighting', () => {
    const legs = [(2 * 40 * 1.15 * HOT * 50) / 1000, (2 * 20 * 3.08 * HOT * 25) / 1000, (2 * 15 * 18.1 * HOT * 3) / 1000].map((v) => v / 230 * 100);
    const k = check(a, 'DB3/1', 'voltage-drop');
    expect(k.value).toBeCloseTo(legs[0]! + legs[1]! + legs[2]!, 2);
    expect(k.limit).toBe(3);
    expect(k.status).toBe('fail');
    expect(k.basis).toMatch(/DB1\/1 2\.39 % \+ DB2\/2 1\.6 % \+ this circuit 0\.847 %/);
  });
  it('has no longest run for DB3/1 and says why: 2.393 + 1.602 = 3.995 % reaches DB3 before its own cable, over the 3 % for lighting', () => {
    const toBoard = [(2 * 40 * 1.15 * HOT * 50) / 1000, (2 * 20 * 3.08 * HOT * 25) / 1000].map((v) => v / 230 * 100);
    expect(toBoard[0]! + toBoard[1]!).toBeGreaterThan(3); // IEC 60364-5-52 Table G.52.1, lighting
    // design Zs alone: (230 × 0.95 / 30 A − 0.6400 Ω) / (2 × 18.1 mΩ/m × 1.1965) = 153.4 m
    // (type B 6 A trips within 0.1 s at 5 In = 30 A, IEC 60898-1)
    const byZs = ((230 * 0.95) / 30 - zdb3) / ((2 * 18.1 * HOT) / 1000);
    expect(byZs).toBeCloseTo(153.4, 1);
    const c = circuit(a, 'DB3/1');
    expect(c.derived.max_length_m).toBeNull();
    expect(c.max_length_basis).toContain('voltage drop from the origin passes at no length from 0.5 m to 5 km (fail at 15 m: the drop from the origin to DB3 is already 4 % of the 3 % allowed)');
    expect(c.max_length_basis).toContain(`design Zs alone would allow up to ${Math.floor(byZs * 10) / 10} m`);
    expect(check(a, 'DB3/1', 'voltage-drop').remedy).toMatch(/no single change tried passes .*: the drop from the origin to DB3 is already 4 % of the 3 % allowed$/);
  });
  it('lists DB3 first in project.yaml yet orders the boards from the origin down', () => {
    expect(a.boards!.map((b) => b.board)).toEqual(['DB1', 'DB2', 'DB3']);
  });
  it('finds the measured Zdb at DB2 plausible (between DB1\'s 0.35 Ω and the derived 0.4926 Ω)', () => {
    expect(check(a, 'DB1/1', 'zs-measured').basis).toContain('plausible');
  });
});

describe('a measured value the tree cannot explain is queried', () => {
  const file = ProjectFileSchema.parse({
    title: 't', client: { name: 'c' }, site: { address: 'a' }, installer: { firm: 'f' },
    supply: { earthing: 'TN-C-S', ze_ohm: '0.35', pfc_ka: '1.5' },
    boards: [{ id: 'DB1' }, { id: 'DB2', fed_by: 'DB1/1', zdb_ohm: '0.2', pfc_ka: '2' }],
  });
  const feeder = CircuitSchema.parse({ board: 'DB1', ref: '1', description: 'd', kind: 'other', ib_a: '50', device: 'fuse:gG', rating_a: '63', live_mm2: '16', cpc_mm2: '10', length_m: '40', method: 'C' });
  const rules = resolveRules(file.supply, file.rules);
  it('a Zdb below the feeding board\'s, and a fault current above it, are attention', () => {
    const s = carry(file.boards, [feeder], file.supply, 230);
    const q = boardQuery(s.get('DB2')!, s.get('DB1')!, rules)!;
    expect(q.status).toBe('attention');
    expect(q.basis).toContain('0.2 Ω is lower than the 0.35 Ω at DB1');
    expect(q.basis).toContain('2 kA is above the 1.5 kA at DB1');
  });
  it('a Zdb well above the derived one is attention: more than the feeding cable explains', () => {
    const high = { ...file, boards: [file.boards[0]!, { ...file.boards[1]!, zdb_ohm: 0.9, pfc_ka: undefined }] };
    const s = carry(high.boards, [feeder], file.supply, 230);
    // bound: 0.4926 × 1.25 + 0.05 = 0.6658 Ω (common practice tolerance of the continuity check)
    expect(boardQuery(s.get('DB2')!, s.get('DB1')!, rules)!.basis).toMatch(/above the derived 0\.493 Ω .* = 0\.666 Ω/);
  });
});

describe('the tree\'s input errors', () => {
  it('refuses a loop and a feeding circuit that does not exist, located in project.yaml', () => {
    const job = loadJob('tests/fixtures/tree-loop');
    expect(job.ok).toBe(false);
    const lines = job.ok ? [] : job.errors.map(formatError);
    expect(lines).toEqual([
      'project.yaml:9:24: boards.1.fed_by: DB2 → DB3 → DB2 is a loop; a board must be fed, through its boards, from the origin',
      'project.yaml:10:24: boards.2.fed_by: DB3 → DB2 → DB3 is a loop; a board must be fed, through its boards, from the origin',
      'project.yaml:11:24: boards.3.fed_by: no circuit 9 on board DB1 in circuits.csv; list the circuit that feeds DB4 there',
    ]);
  });
  it('refuses a board fed by its own circuit, a malformed feed and one circuit feeding two boards', () => {
    const keys = new Set(['DB1/1', 'DB2/1']);
    const p = treeProblems([{ id: 'DB1' }, { id: 'DB2', fed_by: 'DB2/1' }, { id: 'DB3', fed_by: 'DB1' }, { id: 'DB4', fed_by: 'DB1/1' }, { id: 'DB5', fed_by: 'DB1/1' }], keys);
    expect(p.map((x) => x.index)).toEqual([2, 4, 1]);
    expect(p[2]!.message).toContain('DB2 → DB2 is a loop');
    expect(parseFeed('DB1/')).toBeNull();
  });
  it('orders boards from the origin down whatever their order in project.yaml', () => {
    expect(boardOrder([{ id: 'C', fed_by: 'B/1' }, { id: 'B', fed_by: 'A/1' }, { id: 'A' }]).map((b) => b.id)).toEqual(['A', 'B', 'C']);
  });
});

describe('property: lengthening a feeding circuit never lowers a downstream circuit\'s design Zs or voltage drop', () => {
  // Physical monotonicity: every added metre adds resistance to the loop and drop to the path.
  const project = (l1: number, l2: number, measured: number | undefined, sizes: [string, string]): Project => {
    const file = ProjectFileSchema.parse({
      title: 't', client: { name: 'c' }, site: { address: 'a' }, installer: { firm: 'f' },
      supply: { earthing: 'TN-C-S', ze_ohm: '0.3', pfc_ka: '2' },
      boards: [{ id: 'DB1' }, { id: 'DB2', fed_by: 'DB1/1', ...(measured === undefined ? {} : { zdb_ohm: String(measured) }) }, { id: 'DB3', fed_by: 'DB2/9' }],
    });
    const row = (n: number, c: Record<string, string>) => ({ ...CircuitSchema.parse({ kind: 'power', method: 'C', description: 'd', ...c }), row: n });
    const circuits = [
      row(2, { board: 'DB1', ref: '1', ib_a: '40', device: 'fuse:gG', rating_a: '63', live_mm2: sizes[0], cpc_mm2: sizes[1], length_m: String(l1) }),
      row(3, { board: 'DB2', ref: '1', ib_a: '16', device: 'mcb:B', rating_a: '20', live_mm2: '2.5', cpc_mm2: '1.5', length_m: '18' }),
      row(4, { board: 'DB2', ref: '9', ib_a: '20', device: 'mcb:C', rating_a: '32', live_mm2: '6', cpc_mm2: '6', length_m: String(l2) }),
      row(5, { board: 'DB3', ref: '1', ib_a: '3', device: 'mcb:B', rating_a: '6', live_mm2: '1.5', cpc_mm2: '1.5', length_m: '12', kind: 'lighting' }),
    ];
    return { name: 'p', file, circuits, readings: new Map(), rows: [], sessions: [], notes: null };
  };
  const values = (a: Assessment) => a.circuits.filter((c) => c.board !== 'DB1').map((c) => [c.derived.zs_design_ohm!, c.derived.vd_origin_percent!]);
  it('holds for any lengths, sizes and measured Zdb', () => {
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 150 }), fc.integer({ min: 1, max: 80 }), fc.integer({ min: 0, max: 60 }), fc.boolean(),
      fc.option(fc.integer({ min: 5, max: 150 }).map((n) => n / 100), { nil: undefined }),
      fc.constantFrom<[string, string]>(['10', '10'], ['16', '10'], ['25', '16'], ['50', '25']),
      (l1, l2, extra, first, measured, sizes) => {
        const before = values(assess(project(l1, l2, measured, sizes)));
        const after = values(assess(project(first ? l1 + extra : l1, first ? l2 : l2 + extra, measured, sizes)));
        after.forEach(([zs, vd], i) => {
          expect(zs).toBeGreaterThanOrEqual(before[i]![0]!);
          expect(vd).toBeGreaterThanOrEqual(before[i]![1]!);
        });
      },
    ), { numRuns: 40 });
  });
});

describe('the largest device on each board, found in one pass', () => {
  it('is the highest rating on the board, the first of equal ones in the order of circuits.csv, against a search of every circuit for each board', () => {
    const boards = fc.constantFrom('DB1', 'DB2', 'DB3');
    const rows = fc.array(fc.record({ board: boards, rating: fc.constantFrom(6, 10, 16, 20, 32) }), { maxLength: 40 });
    fc.assert(fc.property(rows, (rs) => {
      const circuits = rs.map((r, i) => CircuitSchema.parse({
        board: r.board, ref: String(i + 1), description: 'x', kind: 'power', ib_a: '1', device: 'mcb:B', rating_a: String(r.rating),
        live_mm2: '2.5', cpc_mm2: '1.5', length_m: '10', method: 'C',
      }));
      const top = largestOnBoards(circuits);
      for (const b of ['DB1', 'DB2', 'DB3']) {
        // the search it replaces: every circuit of the board, the first kept unless a later one is rated higher
        const searched = circuits.filter((c) => c.board === b).reduce<(typeof circuits)[number] | null>((a, c) => (a === null || c.rating_a > a.rating_a ? c : a), null);
        if ((top.get(b) ?? null) !== searched) return false;
      }
      return true;
    }), { numRuns: 300 });
  });
});
