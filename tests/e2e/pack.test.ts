// The printed pack: bookmarks, running header and footer, tagging, fonts, paper, long tables.
import { beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { packsmith, NO_ARCHIVE } from '../helpers/cli.js';
import { pdfText } from '../helpers/pdf.js';
import { pdfStructure, type OutlineItem } from '../helpers/pdf-structure.js';

const out = mkdtempSync(join(tmpdir(), 'packsmith-pack-'));
const letter = mkdtempSync(join(tmpdir(), 'packsmith-letter-'));
const pdf = (dir: string, job: string) => readFileSync(join(dir, job, 'draft/pack.pdf'));
const titles = (items: OutlineItem[]) => items.map((i) => i.title);

describe('the printed pack', () => {
  beforeAll(() => {
    const r = packsmith(['build', 'projects/tannery-row-refit', 'tests/fixtures/long-board', '--out', out, ...NO_ARCHIVE]);
    if (r.code !== 0) throw new Error(r.stderr);
    const l = packsmith(['build', 'tests/fixtures/pack-job', '--out', letter, '--paper', 'letter', ...NO_ARCHIVE]);
    if (l.code !== 0) throw new Error(l.stderr);
  });

  it('has a bookmark for every section and board, and under each board one per circuit', async () => {
    const { outline } = await pdfStructure(pdf(out, 'tannery-row-refit'));
    expect(titles(outline)).toEqual(['Tannery Row coffee house refit']);
    const sections = outline[0]!.items;
    expect(titles(sections)).toEqual([
      'Contents', 'Summary', 'Supply and earthing', 'Board DB1 — Rear store', 'Board DB2 — Cellar (retained switchfuse)',
      'Notes', 'Rule set and overrides', 'Changes since the previous revision', 'Safety notes', 'Sign-off',
    ]);
    const db1 = sections[3]!;
    expect(titles(db1.items)).toEqual(['Circuit schedule', 'Measured results', 'Checks and curves']);
    expect(titles(db1.items[2]!.items)).toHaveLength(11);
    expect(db1.items[2]!.items[0]!.title).toBe('Circuit 1 — Lighting shop floor');
    // the notes' own headings sit under "Notes"
    expect(titles(sections[5]!.items)).toEqual(['Scope', 'Departures and observations']);
  });

  it('runs the job and revision along the top of every page, the firm, DRAFT and page X of Y along the bottom', async () => {
    const { pages, text } = await pdfText(pdf(out, 'tannery-row-refit'));
    text.forEach((t, i) => {
      expect(t).toContain('Tannery Row coffee house refit · job tannery-row-refit DRAFT');
      expect(t).toContain(`Quillon & Hart Electrical Ltd DRAFT page ${i + 1} of ${pages}`);
    });
  });

  it('is a tagged PDF: headings, tables and lists keep their structure', async () => {
    const { tagged, roles } = await pdfStructure(pdf(out, 'tannery-row-refit'));
    expect(tagged).toBe(true);
    for (const role of ['H1', 'H2', 'H3', 'H4', 'Table', 'TR', 'TH', 'TD', 'L']) expect(roles, role).toContain(role);
  });

  it('embeds only the DejaVu fonts that scripts/install-deps.sh installs (fonts-dejavu-core and -extra)', async () => {
    const { fonts } = await pdfStructure(pdf(out, 'tannery-row-refit'));
    for (const f of fonts) expect(f).toMatch(/^DejaVu/);
    // the schedule is set in the condensed face (fonts-dejavu-extra), not a substitute
    expect([...fonts]).toEqual(expect.arrayContaining(['DejaVuSans', 'DejaVuSans-Bold', 'DejaVuSansCondensed']));
  });

  it('prints on A4, or on Letter when asked', async () => {
    // ISO 216 A4 210 × 297 mm = 595.3 × 841.9 pt; ANSI Letter 8.5 × 11 in = 612 × 792 pt.
    // Chromium rounds the sheet to whole CSS pixels: allow 0.5 mm (1.5 pt).
    const near = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThan(1.5);
    for (const s of (await pdfStructure(pdf(out, 'tannery-row-refit'))).sizes) {
      near(s.width, 595.3);
      near(s.height, 841.9);
    }
    const html = readFileSync(join(letter, 'pack-job/draft/pack.html'), 'utf8');
    expect(html).toContain('@page { size: letter; }');
    for (const s of (await pdfStructure(pdf(letter, 'pack-job'))).sizes) {
      near(s.width, 612);
      near(s.height, 792);
    }
  });

  it('splits a long schedule across pages with its header repeated and no row cut in half', async () => {
    const { text } = await pdfText(pdf(out, 'long-board'));
    const header = 'Ref Circuit Device In A Ib A Iz A Cable Method Length m Max Zs Ω Design Zs Ω Disconn. s Required s VD % Min cpc mm² Status';
    const walls = ['north wall by the racking', 'south wall under the mezzanine', 'east dock doors and ramp', 'west aisle end and charging point'];
    const schedulePages = text.map((t, i) => ({ t, i })).filter(({ t }) => /S\d+ Sockets bay \d+ [a-z ]+ mcb:B 20/.test(t));
    expect(schedulePages.length).toBeGreaterThanOrEqual(2);
    for (const { t } of schedulePages) expect(t).toContain(header);
    for (let i = 1; i <= 45; i++) {
      // the whole row on one page: ref, wrapped description, device and rating together
      const row = `S${i} Sockets bay ${i} ${walls[i % 4]} mcb:B 20 12`;
      expect(schedulePages.filter(({ t }) => t.includes(row)), row).toHaveLength(1);
    }
  });
});
