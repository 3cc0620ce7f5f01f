// A generated archive for the bench: N invented jobs of 10–40 circuits on 1–3 boards, each with a
// test session and some with a re-test. Deterministic (seeded), so every run builds the same jobs.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/** Write a file where its text differs: generated again, an archive keeps its files' times, as a real one does between re-tests. */
function put(path: string, text: string): void {
  try {
    if (readFileSync(path, 'utf8') === text) return;
  } catch { /* not there yet */ }
  writeFileSync(path, text);
}

/** mulberry32: a small seeded generator (bench data only; nothing here needs real randomness). */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const ROOMS = ['kitchen', 'office', 'store', 'landing', 'workshop', 'hall', 'plant room', 'yard', 'bay', 'studio'];
const USES = [
  { what: 'Lighting', kind: 'lighting', device: 'mcb:B', rating: 6, live: 1.5, cpc: 1.0, ib: 3 },
  { what: 'Sockets', kind: 'power', device: 'rcbo:B', rating: 20, live: 2.5, cpc: 1.5, ib: 14, rcd: true },
  { what: 'Sockets', kind: 'power', device: 'rcbo:B', rating: 32, live: 2.5, cpc: 1.5, ib: 20, rcd: true, ring: true },
  { what: 'Heater', kind: 'heating', device: 'mcb:B', rating: 16, live: 2.5, cpc: 1.5, ib: 11 },
  { what: 'Extract fan', kind: 'motor', device: 'mcb:C', rating: 10, live: 1.5, cpc: 1.0, ib: 2 },
  { what: 'Machine', kind: 'motor', device: 'mcb:D', rating: 16, live: 4, cpc: 2.5, ib: 9 },
  { what: 'Cooker', kind: 'power', device: 'mcb:B', rating: 32, live: 6, cpc: 2.5, ib: 22 },
  { what: 'Old sockets', kind: 'power', device: 'fuse:bs3036', rating: 30, live: 4, cpc: 1.5, ib: 13 },
] as const;

/** A YAML double-quoted scalar (JSON strings are valid YAML). */
const q = (s: string): string => JSON.stringify(s);

export interface Generated { root: string; jobs: string[]; circuits: number }

/** How big each job is: circuits and boards drawn between these bounds (default 10–40 circuits on 1–3 boards). */
export interface JobSize { circuits?: [number, number]; boards?: [number, number] }

export function generateArchive(root: string, count: number, seed = 7, size: JobSize = {}): Generated {
  const [cLo, cHi] = size.circuits ?? [10, 40];
  const [bLo, bHi] = size.boards ?? [1, 3];
  const rnd = random(seed);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
  const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const jobs: string[] = [];
  let circuits = 0;
  for (let j = 1; j <= count; j++) {
    const name = `bench-job-${String(j).padStart(3, '0')}`;
    const dir = join(root, name);
    mkdirSync(join(dir, 'readings'), { recursive: true });
    const boards = Array.from({ length: int(bLo, bHi) }, (_, b) => `DB${b + 1}`);
    const ze = (0.15 + rnd() * 0.25).toFixed(2);
    put(join(dir, 'project.yaml'), [
      '# Generated bench job: an invented scenario.',
      `title: ${q(`Bench job ${j}, unit ${int(1, 40)} ${pick(['Mill Lane', 'Quarry Road', 'Harbour Walk', 'Station Yard'])}`)}`,
      `client: { name: ${q(`Bench Client ${j} Ltd`)} }`,
      `site: { address: ${q(`Unit ${j}, Benchmark Estate`)} }`,
      'installer: { firm: Bench Electrical Ltd, contact: bench@bench.example }',
      'dates: { started: 2026-01-05, completed: 2026-01-16 }',
      `supply: { earthing: TN-C-S, u0_v: 230, phases: 1, ze_ohm: ${ze}, pfc_ka: ${(1 + rnd() * 3).toFixed(1)}, main_switch: 100 A 2-pole }`,
      'boards:',
      ...boards.map((b) => `  - { id: ${b}, location: ${q(pick(ROOMS))} }`),
      '',
    ].join('\n'));
    const n = int(cLo, cHi);
    circuits += n;
    const circuitRows = ['board,ref,description,kind,ib_a,device,rating_a,live_mm2,cpc_mm2,length_m,method,rcd_ma,rcd_type,ring'];
    const readingRows = ['board,ref,r1r2_ohm,ir_ll_mohm,ir_le_mohm,ir_test_v,polarity,zs_ohm,rcd_1x_ms,rcd_5x_ms,rcd_button,tested_by'];
    const retest = ['board,ref,zs_ohm,r1r2_ohm,tested_by'];
    for (let c = 1; c <= n; c++) {
      const board = boards[(c - 1) % boards.length]!;
      const u = pick(USES);
      const rcd = 'rcd' in u && u.rcd;
      const ring = 'ring' in u && u.ring;
      const length = int(5, 60);
      circuitRows.push([board, c, `${u.what} ${pick(ROOMS)} ${c}`, u.kind, u.ib, u.device, u.rating, u.live, u.cpc, length, pick(['B2', 'C', 'C', 'A1']), rcd ? 30 : '', rcd ? 'A' : '', ring ? 'yes' : 'no'].join(','));
      // R1+R2 ≈ 2 × 12.1 mΩ/m × length for 1.5/1.0-ish cables, scaled roughly by size (bench data only)
      const r1r2 = (length * (0.0185 / u.cpc + 0.0185 / u.live) * (0.9 + rnd() * 0.2)).toFixed(2);
      const zs = (Number(ze) + Number(r1r2)).toFixed(2);
      const ir = rnd() < 0.9 ? '>999' : (1 + rnd() * 50).toFixed(1);
      readingRows.push([board, c, r1r2, ir, ir, 500, rnd() < 0.99 ? 'ok' : 'fail', rnd() < 0.97 ? zs : 'not-tested',
        rcd ? int(15, 35) : '', rcd ? int(7, 15) : '', rcd ? 'ok' : '', 'B. Tester'].join(','));
      if (rnd() < 0.05) retest.push([board, c, (Number(zs) * 0.97).toFixed(2), (Number(r1r2) * 0.97).toFixed(2), 'B. Tester'].join(','));
    }
    put(join(dir, 'circuits.csv'), `${circuitRows.join('\n')}\n`);
    put(join(dir, 'readings/2026-01-16.csv'), `${readingRows.join('\n')}\n`);
    if (retest.length > 1) put(join(dir, 'readings/2026-01-23-retest.csv'), `${retest.join('\n')}\n`);
    put(join(dir, 'notes.md'), `## Scope\n\nGenerated job ${j} for the bench: ${n} circuits on ${boards.length} board(s).\n`);
    jobs.push(dir);
  }
  return { root, jobs, circuits };
}

/** The bench's large job: one job of `circuits` circuits, about 40 a board, under `root`; its folder and boards. */
export function generateLargeJob(root: string, circuits: number): { dir: string; boards: number } {
  const boards = Math.max(1, Math.round(circuits / 40));
  return { dir: generateArchive(root, 1, 7, { circuits: [circuits, circuits], boards: [boards, boards] }).jobs[0]!, boards };
}
