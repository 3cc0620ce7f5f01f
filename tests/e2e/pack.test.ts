// The printed pack: bookmarks, running header and footer, tagging, fonts, paper, long tables.
import { beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run, NO_ARCHIVE } from '../helpers/cli.js';
import { pdfText, pdfWords, type PageWords } from '../helpers/pdf.js';
import { pdfStructure, type OutlineItem } from '../helpers/pdf-structure.js';

const out = mkdtempSync(join(tmpdir(), 'packsmith-pack-'));
const letter = mkdtempSync(join(tmpdir(), 'packsmith-letter-'));
const pdf = (dir: string, job: string) => readFileSync(join(dir, job, 'draft/pack.pdf'));
const titles = (items: OutlineItem[]) => items.map((i) => i.title);

describe('the printed pack', () => {
  beforeAll(async () => {
    const r = await run(['build', 'projects/tannery-row-refit', 'projects/marsh-street-surgery', 'projects/heronsgate-pottery', 'tests/fixtures/long-board', '--out', out, ...NO_ARCHIVE]);
    if (r.code !== 0) throw new Error(r.stderr);
    const l = await run(['build', 'tests/fixtures/pack-job', '--out', letter, '--paper', 'letter', ...NO_ARCHIVE]);
    if (l.code !== 0) throw new Error(l.stderr);
  });

  it('has a bookmark for every section and board, and in the appendix one per circuit', async () => {
    const { outline } = await pdfStructure(pdf(out, 'tannery-row-refit'));
    expect(titles(outline)).toEqual(['Tannery Row coffee house refit']);
    const sections = outline[0]!.items;
    expect(titles(sections)).toEqual([
      'Contents', 'Summary', 'Supply and earthing', 'Board DB1 — Rear store', 'Board DB2 — Cellar (retained switchfuse)',
      'Notes', 'Rule set and overrides', 'Changes since the previous revision', 'Safety notes', 'Sign-off',
      'Appendix: the checks of each circuit',
    ]);
    const db1 = sections[3]!;
    expect(titles(db1.items)).toEqual(['Circuit schedule', 'Test results']);
    const appendix = sections[10]!;
    expect(titles(appendix.items)).toEqual(['Board DB1 — Rear store', 'Board DB2 — Cellar (retained switchfuse)']);
    expect(titles(appendix.items[0]!.items)).toHaveLength(11);
    expect(appendix.items[0]!.items[0]!.title).toMatch(/^Circuit 1 — Lighting shop floor/);
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

  it('prints on A4, or on Letter when asked; the board schedules on landscape sheets', async () => {
    // ISO 216 A4 210 × 297 mm = 595.3 × 841.9 pt; ANSI Letter 8.5 × 11 in = 612 × 792 pt.
    // Chromium rounds the sheet to whole CSS pixels: allow 0.5 mm (1.5 pt).
    const near = (a: number, b: number) => Math.abs(a - b) < 1.5;
    const sheet = (s: { width: number; height: number }, w: number, h: number) => (near(s.width, w) && near(s.height, h)) || (near(s.width, h) && near(s.height, w));
    const a4 = (await pdfStructure(pdf(out, 'tannery-row-refit'))).sizes;
    for (const s of a4) expect(sheet(s, 595.3, 841.9), JSON.stringify(s)).toBe(true);
    const { text } = await pdfText(pdf(out, 'tannery-row-refit'));
    const landscape = a4.map((s, i) => (s.width > s.height ? i : -1)).filter((i) => i >= 0);
    expect(landscape.length).toBeGreaterThan(0);
    // exactly the pages of the board schedules are landscape
    text.forEach((t, i) => expect(landscape.includes(i), `page ${i + 1}`).toBe(/Test results|Circuit schedule/.test(t)));
    const html = readFileSync(join(letter, 'pack-job/draft/pack.html'), 'utf8');
    expect(html).toContain('@page { size: letter; }');
    for (const s of (await pdfStructure(pdf(letter, 'pack-job'))).sizes) expect(sheet(s, 612, 792), JSON.stringify(s)).toBe(true);
  });

  it('splits a long schedule across pages with its header repeated and no row cut in half', async () => {
    const { text } = await pdfText(pdf(out, 'long-board'));
    const header = 'Ref Circuit Device In A Ib A Iz A Cable Method Length m Max Zs Ω Design Zs Ω Disconn. s Required s VD % Min cpc mm² VD from origin % Longest run m Design';
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

  it('sets no text under 6 pt anywhere, curve labels, footnote marks and symbols included', async () => {
    for (const [dir, job] of [[out, 'tannery-row-refit'], [out, 'marsh-street-surgery'], [out, 'heronsgate-pottery'], [out, 'long-board'], [letter, 'pack-job']] as const) {
      const pages = await pdfWords(pdf(dir, job));
      const smallest = pages.flatMap((p, i) => p.words.map((w) => ({ ...w, page: i + 1 }))).reduce((a, b) => (b.size < a.size ? b : a));
      expect(smallest.size, `${job}: "${smallest.str}" on page ${smallest.page}`).toBeGreaterThanOrEqual(6);
    }
  });

  it('keeps the demo house within 10 pages, and no page less than a third full except before a section that starts a page', async () => {
    // heronsgate-pottery is the house (a cottage board feeding a studio and a kiln room)
    for (const job of ['heronsgate-pottery', 'tannery-row-refit', 'marsh-street-surgery']) {
      const pages = await pdfWords(pdf(out, job));
      expect(pages.length, job).toBeLessThanOrEqual(10);
      // the printed area: the sheet less its 18 mm top and 16 mm bottom margins (where the running header and footer sit)
      const mm = 72 / 25.4;
      const fill = pages.map((p) => {
        const body = p.words.filter((w) => w.top > 18 * mm && w.top < p.height - 16 * mm);
        return (Math.max(...body.map((w) => w.top)) - 18 * mm) / (p.height - 34 * mm);
      });
      const startsSection = (i: number) => {
        const first = pages[i]!.words.filter((w) => w.top > 18 * mm).sort((a, b) => a.top - b.top)[0];
        const landscape = (p: PageWords) => p.width > p.height;
        // a page of another orientation, the appendix, or the page after the cover must start afresh
        return i === 1 || landscape(pages[i]!) !== landscape(pages[i - 1]!) || /^Appendix/.test(first?.str ?? '');
      };
      fill.forEach((f, i) => {
        if (i === pages.length - 1 || startsSection(i + 1)) return;
        expect(f, `${job} page ${i + 1} is ${Math.round(f * 100)} % full`).toBeGreaterThan(1 / 3);
      });
    }
  });
});
