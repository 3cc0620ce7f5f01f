// End to end: the compiled CLI builds the demo job into a temporary folder; the PDF is read back.
import { beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run, NO_ARCHIVE } from '../helpers/cli.js';
import { pdfInfo, pdfText } from '../helpers/pdf.js';
import { sha } from '../helpers/archive.js';
import { explainPdfDifference } from '../helpers/pdf-diff.js';
import { readJob } from '../../src/load/job.js';
import { validate } from '../../src/model/validate.js';

const DEMO = 'projects/tannery-row-refit';

describe('packsmith build (demo job)', () => {
  const out = mkdtempSync(join(tmpdir(), 'packsmith-e2e-'));
  let built: Awaited<ReturnType<typeof run>>;
  beforeAll(async () => {
    built = await run(['build', DEMO, '--out', out, ...NO_ARCHIVE]);
  });

  it('exits 0 and writes HTML, PDF and the site index', async () => {
    expect(built.stderr).toBe('');
    expect(built.code).toBe(0);
    for (const f of ['tannery-row-refit/draft/pack.html', 'tannery-row-refit/draft/pack.pdf', 'index.html']) {
      expect(existsSync(join(out, f))).toBe(true);
    }
  });

  it('prints a paged PDF naming every circuit, with DRAFT and page X of Y on every page', async () => {
    const { pages, text } = await pdfText(readFileSync(join(out, 'tannery-row-refit/draft/pack.pdf')));
    expect(pages).toBeGreaterThan(1);
    const all = text.join(' ');
    const v = validate(readJob(DEMO));
    if (!v.ok) throw new Error('demo invalid');
    for (const c of v.project.circuits) expect(all).toContain(`Circuit ${c.ref} — ${c.description}`);
    text.forEach((t, i) => {
      expect(t).toContain('DRAFT');
      expect(t).toContain(`page ${i + 1} of ${pages}`);
    });
  });

  it('gives the same SHA-256 for pack.html and pack.pdf when built again into another folder', async () => {
    const again = mkdtempSync(join(tmpdir(), 'packsmith-e2e-again-'));
    expect((await run(['build', DEMO, '--out', again, ...NO_ARCHIVE])).code).toBe(0);
    for (const f of ['pack.html', 'pack.pdf']) {
      const [a, b] = [join(out, 'tannery-row-refit/draft', f), join(again, 'tannery-row-refit/draft', f)];
      expect(sha(b), explainPdfDifference(a, b)).toBe(sha(a));
    }
  });

  it('dates the draft PDF by its last test session and names the firm and the job', async () => {
    const { info, attachments } = await pdfInfo(readFileSync(join(out, 'tannery-row-refit/draft/pack.pdf')));
    expect(info).toMatchObject({
      Title: 'Tannery Row coffee house refit — DRAFT', Author: 'Quillon & Hart Electrical Ltd', Subject: 'tannery-row-refit',
      CreationDate: 'D:20261120000000Z', ModDate: 'D:20261120000000Z',
    });
    expect(JSON.parse(attachments['data.json']!.toString())).toMatchObject({ job: 'tannery-row-refit', revision: null });
  });

  it('writes the HTML and says how to get PDFs when no Chromium is found', async () => {
    const bare = mkdtempSync(join(tmpdir(), 'packsmith-nochrome-'));
    const r = await run(['build', DEMO, '--out', bare, ...NO_ARCHIVE], { PACKSMITH_CHROME: '/nonexistent/chromium' });
    expect(r.code).toBe(0);
    expect(existsSync(join(bare, 'tannery-row-refit/draft/pack.html'))).toBe(true);
    expect(existsSync(join(bare, 'tannery-row-refit/draft/pack.pdf'))).toBe(false);
    expect(r.stderr).toMatch(/No Chromium found.*apt-get install -y chromium.*PACKSMITH_CHROME/);
  });
});

describe('packsmith check', () => {
  it('prints every error of a broken job as file:row:column: message and exits 2', async () => {
    const r = await run(['check', 'tests/fixtures/broken-job']);
    expect(r.code).toBe(2);
    const lines = r.stderr.trim().split('\n');
    const located = lines.filter((l) => /^[\w./-]+:\d+:\d+: /.test(l));
    expect(located.length).toBeGreaterThanOrEqual(17);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
  });
  it('gives the errors in the JSON too', async () => {
    const r = await run(['check', 'tests/fixtures/broken-job', '--json']);
    expect(r.code).toBe(2);
    const json = JSON.parse(r.stdout) as { errors: { file: string; row: number; column: number; message: string }[] };
    expect(json.errors[0]).toMatchObject({ file: 'project.yaml', row: 7, column: 13 });
  });
  it('exits 1 on the demo (open items) with the JSON of CONTRACT.md', async () => {
    const r = await run(['check', DEMO, '--json']);
    expect(r.code).toBe(1);
    const json = JSON.parse(r.stdout) as { job: string; rules: Record<string, unknown>; circuits: { derived: Record<string, unknown>; checks: { id: string; status: string }[] }[]; summary: Record<string, number> };
    expect(json.job).toBe('tannery-row-refit');
    expect(json.rules).toMatchObject({ set: 'iec-60364', u0_v: 230, cmin: 0.95, measured_zs_factor: 0.8 });
    expect(Object.keys(json.summary)).toEqual(['pass', 'fail', 'attention', 'not-verified', 'n/a']);
    const total = json.circuits.reduce((n, c) => n + c.checks.length, 0);
    expect(Object.values(json.summary).reduce((a, b) => a + b, 0)).toBe(total);
  });
  it('refuses an unknown option plainly', async () => {
    const r = await run(['check', DEMO, '--jsn']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^packsmith: /);
  });
});
