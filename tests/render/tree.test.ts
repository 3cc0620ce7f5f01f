// The demo job with three levels of boards (projects/heronsgate-pottery) as its pack shows it: the
// tree, derived and measured Zdb side by side, the voltage drop from the origin, selectivity with
// both bands on the feeding circuit's curve, and the longest run — each figure worked by hand.
import { describe, expect, it } from 'vitest';
import { loadJob } from '../../src/job.js';
import { renderPack } from '../../src/render/pack.js';
import { downTo3 } from '../../src/render/sections/schedules.js';

const j = loadJob('projects/heronsgate-pottery');
if (!j.ok) throw new Error('the demo job does not validate');
const html = renderPack(j.project, j.assessment, { revisionLabel: 'DRAFT', draft: true, date: '2026-11-24' });
const text = (s: string) => s.replace(/<[^>]+>/g, ' ').replace(/&#x3D;/g, '=').replace(/\s+/g, ' ');
const between = (from: string, to: string) => html.slice(html.indexOf(from), html.indexOf(to, html.indexOf(from) + 1));
const boardDb2 = text(between('id="board-DB2"', 'id="board-DB3"'));
const boardDb3 = text(between('id="board-DB3"', 'id="notes"'));
/** the numeric cells of a row of the circuit schedule, as text (the last is the longest run) */
const numbers = (board: string, ref: string) => {
  const at = html.indexOf(`href="#circuit-${board}-${ref}"`, html.indexOf(`id="board-${board}"`));
  return [...html.slice(at, html.indexOf('</tr>', at)).matchAll(/<td class="n">([^<]*)<\/td>/g)].map((m) => m[1]);
};

// Copper at 20 °C: 16 mm² 1.15, 10 mm² 1.83 mΩ/m (IEC 60228 Table 2); × (1 + 0.00393 × 50) at
// 70 °C for PVC (IEC 60287-1-1 Table 1; IEC 60364-5-52 Table 52.1).
const HOT = 1 + 0.00393 * 50;

describe('the pack of a three-level installation (projects/heronsgate-pottery)', () => {
  it('shows which board feeds which, through which circuit', () => {
    expect(boardDb2).toContain('Fed from DB1 through circuit DB1/6 ; feeds DB3 (circuit 4).');
    expect(boardDb3).toContain('Fed from DB2 through circuit DB2/4 .');
    expect(text(between('id="board-DB1"', 'id="board-DB2"'))).toContain('Fed from the origin; feeds DB2 (circuit 6).');
  });
  it('puts the derived Zdb at DB2 beside the measured one: 0.22 + 42 m × 2 × 1.15 mΩ/m × 1.1965 = 0.336 Ω, measured 0.38 Ω', () => {
    const derived = 0.22 + (42 * 2 * 1.15 * HOT) / 1000; // 0.3356 Ω
    expect(derived).toBeCloseTo(0.3356, 4);
    expect(boardDb2).toMatch(new RegExp(`Zdb \\(Ω\\) ${derived.toFixed(3)} 0.38 `));
    expect(boardDb2).toContain('design checks use 0.38 Ω'); // the larger of the two
    // DB3 carries on from the 0.38 Ω DB2 is designed with: + 12 m × 2 × 1.83 mΩ/m × 1.1965 = 0.433 Ω
    expect(boardDb3).toMatch(new RegExp(`Zdb \\(Ω\\) ${(0.38 + (12 * 2 * 1.83 * HOT) / 1000).toFixed(3)} — `));
  });
  it('gives the voltage drop from the origin leg by leg: 2 × 42 m × 1.376 mΩ/m × 45 A = 2.26 %, + 2 × 12 m × 2.19 mΩ/m × 32 A = 0.73 %', () => {
    const legs = [(2 * 42 * 1.15 * HOT * 45) / 1000, (2 * 12 * 1.83 * HOT * 32) / 1000].map((v) => (v / 230) * 100);
    expect(legs[0]).toBeCloseTo(2.26, 2);
    expect(legs[1]).toBeCloseTo(0.73, 2);
    expect(boardDb3).toContain(`Voltage drop from the origin to this board: DB1/6 2.26 % + DB2/4 0.73 % = ${(legs[0]! + legs[1]!).toFixed(2)} %.`);
  });
  it('draws both bands on the sub-main\'s curve, and the fault current at the board it feeds', () => {
    const entry = between('id="circuit-DB1-6"', 'id="circuit-DB2-1"');
    const svg = entry.slice(entry.indexOf('<figure class="snippet">'));
    expect(svg).toContain('class="band"'); // gG 80 A (IEC 60269-1 gates)
    expect(svg).toContain('class="band2"'); // mcb:C 40 A (IEC 60898-1, type C), hatched
    expect(svg).toContain('class="upto"');
    // 230 V / (230 V / 2.4 kA + 2 × 42 m × 1.15 mΩ/m at 20 °C) = 1195 A → 1200 A (3 figures)
    expect(230 / (230 / 2400 + (2 * 42 * 1.15) / 1000)).toBeCloseTo(1195.2, 1);
    expect(text(svg)).toContain('hatched: DB2/4 mcb:C 40 A, the largest device on DB2, for selectivity up to 1200 A');
    expect(text(entry)).toMatch(/overlap from \d+ A, up to 1200 A/);
  });
  it('shows the longest run, and "none" with the reason where no length passes', () => {
    // DB2/4, mcb:C 40 A at 5 s: Ia = 10 In = 400 A (IEC 60898-1, type C, Cmin 0.95 CENELEC TR 50480):
    // (230 × 0.95 / 400 − 0.38) / (2 × 1.83 mΩ/m × 1.1965) = 37.9 m, set by design Zs
    const byZs = ((230 * 0.95) / 400 - 0.38) / ((2 * 1.83 * HOT) / 1000);
    expect(numbers('DB2', '4').at(-1)).toBe(String(Math.floor(byZs * 10) / 10));
    expect(numbers('DB3', '2').at(-1)).toBe('none');
    expect(boardDb3).toContain('longest run none: no run of any length passes (the appendix says why of both)');
    // 2.26 + 0.73 = 2.99 % reaches DB3 (above); 3 % for lighting (IEC 60364-5-52 Table G.52.1)
    const entry = text(between('id="circuit-DB3-2"', '</section>'));
    expect(entry).toContain('Longest run none: voltage drop from the origin passes at no length from 0.5 m to 5 km (fail at 15 m: the drop from the origin to DB3 is already 2.99 % of the 3 % allowed)');
    expect(entry).toContain('No single change tried passes');
  });
  it('prints the longest run to three figures rounded down, never up (projects/tannery-row-refit DB1/3: 129.7 m → 129)', () => {
    const p = loadJob('projects/tannery-row-refit');
    if (!p.ok) throw new Error('the demo job does not validate');
    const found = p.assessment.circuits.find((c) => c.board === 'DB1' && c.ref === '3')!.derived.max_length_m!;
    expect(found).toBeGreaterThanOrEqual(100);
    expect(Math.round(found)).toBeGreaterThan(Math.floor(found)); // rounded to nearest it would print more
    const page = renderPack(p.project, p.assessment, { revisionLabel: 'DRAFT', draft: true, date: '2026-11-24' });
    const at = page.indexOf('href="#circuit-DB1-3"', page.indexOf('id="board-DB1"'));
    const cells = [...page.slice(at, page.indexOf('</tr>', at)).matchAll(/<td class="n">([^<]*)<\/td>/g)].map((m) => m[1]);
    expect(cells.at(-1)).toBe(String(Math.floor(found)));
    expect([downTo3(37.9), downTo3(4999.9), downTo3(0.55)]).toEqual([37.9, 4990, 0.55]);
  });
});
