// End to end: issue revisions with the compiled CLI, change a reading, issue again, tamper, verify.
import { afterAll, describe, expect, it, vi } from 'vitest';
import { chmodSync, existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';
import { run, startPacksmith } from '../helpers/cli.js';
import { pdfInfo, pdfText } from '../helpers/pdf.js';
import { archiveOf, copyFixture, edit, folderHashes, mode, removeTree, scratch, sha } from '../helpers/archive.js';

vi.setConfig({ testTimeout: 240_000 }); // each case prints at least one pack
const made: string[] = [];
const place = (label: string) => { const d = scratch(label); made.push(d); return d; };
afterAll(() => made.forEach(removeTree));

const issue = (job: string, out: string, ...more: string[]) =>
  run(['issue', job, '--by', 'T. Marwood', '--out', out, ...more]);

/** The changes section of a pack: its sub-headings and its table rows, as text. */
function changesOf(html: string): { headings: string[]; rows: string[] } {
  const section = /<section id="changes">([\s\S]*?)<\/section>/.exec(html)?.[1] ?? '';
  const text = (s: string) => s.replace(/<[^>]+>/g, ' ').replace(/\s+/g, ' ').trim();
  return {
    headings: [...section.matchAll(/<h[23]>(.*?)<\/h[23]>/g)].map((m) => text(m[1]!)),
    rows: [...section.matchAll(/<tbody>([\s\S]*?)<\/tbody>/g)].flatMap((m) => [...m[1]!.matchAll(/<tr>(.*?)<\/tr>/g)].map((r) => text(r[1]!))),
  };
}

describe('packsmith issue: two revisions of one job', () => {
  const root = place('issue');
  const job = copyFixture('archive-job', root);
  const out = join(root, 'out');
  const archive = join(root, 'archive');
  const rev = (n: number) => join(archive, 'archive-job', `rev-${n}`);
  let first: Record<string, string>;

  it('refuses while a check is not verified, unless open items are accepted', async () => {
    edit(job, 'readings/2026-10-09.csv', '500,ok,1.08', '500,not-tested,1.08');
    const r = await issue(job, out, '--date', '2026-10-10');
    edit(job, 'readings/2026-10-09.csv', '500,not-tested,1.08', '500,ok,1.08');
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/archive-job has 1 not verified check, so no revision was issued/);
    expect(r.stderr).toMatch(/--accept-open-items/);
    expect(existsSync(rev(1))).toBe(false);
    expect(existsSync(join(job, 'revisions.yaml'))).toBe(false);
  });

  it('issues Revision 1: four read-only files, recorded in revisions.yaml', async () => {
    const r = await issue(job, out, '--date', '2026-10-10', '--reason', 'Handover', '--accept-open-items');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(readdirSync(rev(1)).sort()).toEqual(['data.json', 'manifest.json', 'pack.html', 'pack.pdf']);
    expect(mode(rev(1))).toBe(0o555);
    for (const f of readdirSync(rev(1))) expect(mode(join(rev(1), f))).toBe(0o444);
    const record = parse(readFileSync(join(job, 'revisions.yaml'), 'utf8')) as { revisions: Record<string, unknown>[] };
    expect(record.revisions).toEqual([expect.objectContaining({ revision: 1, date: '2026-10-10', by: 'T. Marwood', reason: 'Handover', accepted_open_items: false })]); // nothing was open, so nothing was accepted
    expect(readFileSync(join(rev(1), 'pack.html'), 'utf8')).not.toMatch(/Issued with open items accepted/);
    const manifest = JSON.parse(readFileSync(join(rev(1), 'manifest.json'), 'utf8')) as Record<string, any>;
    expect(Object.keys(manifest.inputs)).toEqual(['circuits.csv', 'project.yaml', 'readings/2026-10-09.csv']);
    expect(manifest.inputs['circuits.csv']).toBe(sha(join(job, 'circuits.csv')));
    expect(manifest.outputs['pack.pdf']).toBe(sha(join(rev(1), 'pack.pdf')));
    // the page's hash is taken of the bytes as they are written (FIPS 180-4 SHA-256 of the file)
    expect(manifest.outputs['pack.html']).toBe(sha(join(rev(1), 'pack.html')));
    expect(manifest.rules).toMatchObject({ set: 'iec-60364', cmin: 0.95, overrides: [] });
    expect(manifest.previous).toBeNull();
    first = folderHashes(rev(1));
  });

  it('gives byte-identical files when the same inputs are issued on the same date into another archive', async () => {
    const other = place('same');
    const copy = copyFixture('archive-job', other);
    expect((await issue(copy, join(other, 'out'), '--date', '2026-10-10', '--reason', 'Handover', '--accept-open-items')).code).toBe(0);
    expect(folderHashes(join(other, 'archive/archive-job/rev-1'))).toEqual(first);
  });

  it('prints "Revision 1" and its date on every page, with title, firm, job, dates and data.json in the PDF', async () => {
    const pdf = readFileSync(join(rev(1), 'pack.pdf'));
    const { pages, text } = await pdfText(pdf);
    text.forEach((t) => {
      expect(t).toContain('Revision 1 · 2026-10-10');
      expect(t).not.toContain('DRAFT');
    });
    expect(pages).toBeGreaterThan(1);
    const { info, attachments } = await pdfInfo(pdf);
    expect(info).toMatchObject({
      Title: 'Lantern Yard workshop additions — Revision 1', Author: 'Brackwater Electrical Co-op', Subject: 'archive-job',
      CreationDate: 'D:20261010000000Z', ModDate: 'D:20261010000000Z', Creator: 'packsmith',
    });
    expect(attachments['data.json']!.equals(readFileSync(join(rev(1), 'data.json')))).toBe(true);
    expect(changesOf(readFileSync(join(rev(1), 'pack.html'), 'utf8')).headings).toEqual(['Issue']);
  });

  it('after one reading changes, issues Revision 2 listing exactly that change; Revision 1 is untouched', async () => {
    edit(job, 'readings/2026-10-09.csv', 'ok,1.08,', 'ok,1.12,');
    const r = await issue(job, out, '--date', '2026-10-12', '--reason', 'Zs re-read', '--accept-open-items');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('issued Revision 2');
    const { headings, rows } = changesOf(readFileSync(join(rev(2), 'pack.html'), 'utf8'));
    expect(headings).toEqual(['Changes since Revision 1', 'Readings changed']);
    expect(rows).toEqual(['DB1 1 Measured Zs 1.08 Ω on 2026-10-09 1.12 Ω on 2026-10-09']);
    expect(folderHashes(rev(1))).toEqual(first);
    expect(mode(rev(1))).toBe(0o555);
    const m2 = JSON.parse(readFileSync(join(rev(2), 'manifest.json'), 'utf8')) as Record<string, any>;
    expect(m2.previous).toEqual({ revision: 1, manifest_sha256: first['manifest.json'] });
    const record = parse(readFileSync(join(job, 'revisions.yaml'), 'utf8')) as { revisions: { revision: number }[] };
    expect(record.revisions.map((e) => e.revision)).toEqual([1, 2]);
    expect((await run(['verify', join(root, 'projects')])).code).toBe(0);
    expect(existsSync(join(out, 'archive-job', 'rev-1'))).toBe(false); // never under --out
  });

  it('refuses when nothing changed since the last revision', async () => {
    const r = await issue(job, out, '--date', '2026-10-13', '--accept-open-items');
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/nothing changed since Revision 2 \(issued 2026-10-12\)/);
    expect(existsSync(rev(3))).toBe(false);
  });

  it('refuses to issue into an archive that lacks the revisions revisions.yaml records', async () => {
    const r = await issue(job, out, '--date', '2026-10-13', '--accept-open-items', '--archive', join(root, 'elsewhere'));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/revisions\.yaml: records revision 1, which .*elsewhere\/archive-job does not hold/);
    expect(existsSync(join(root, 'elsewhere'))).toBe(false);
  });

  it('refuses an issue date before the previous revision', async () => {
    edit(job, 'readings/2026-10-09.csv', 'ok,1.12,', 'ok,1.10,');
    const r = await issue(job, out, '--date', '2026-10-11', '--accept-open-items');
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/before Revision 2's \(2026-10-12\)/);
  });

  it('verify names one altered byte of an issued PDF and exits 1; issue then refuses to add to that archive', async () => {
    const pdf = join(rev(1), 'pack.pdf');
    chmodSync(pdf, 0o644);
    const bytes = readFileSync(pdf);
    const at = bytes.length >> 1;
    bytes[at] = bytes[at]! ^ 0x01;
    writeFileSync(pdf, bytes);
    const v = await run(['verify', join(root, 'projects')]);
    expect(v.code).toBe(1);
    expect(v.stdout).toContain(`${join(archive, 'archive-job/rev-1/pack.pdf')}: altered`);
    expect(v.stdout.split('\n').filter((l) => l.startsWith(archive)).join('\n')).not.toMatch(/rev-2/); // findings name rev-1 only
    const r = await issue(job, out, '--date', '2026-10-14', '--accept-open-items');
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/do(es)? not check out/);
    expect(existsSync(rev(3))).toBe(false);
  });
});

describe('packsmith issue: refusals and open items', () => {
  it('refuses a job with a failing check without the flag; with it, the pack lists the fail first', async () => {
    const root = place('failing');
    const job = copyFixture('failing-job', root);
    const out = join(root, 'out');
    const refused = await issue(job, out, '--date', '2026-10-10');
    expect(refused.code).toBe(1);
    expect(refused.stderr).toMatch(/failing-job has 1 failed check, so no revision was issued/);
    expect(refused.stderr.split('\n')[1]).toMatch(/DB1 circuit 2 polarity: fail/);
    const r = await issue(job, out, '--date', '2026-10-10', '--accept-open-items');
    expect(r.code).toBe(0);
    const html = readFileSync(join(archiveOf(job), 'failing-job/rev-1/pack.html'), 'utf8');
    const openAt = html.indexOf('<h3>Open items</h3>');
    expect(openAt).toBeGreaterThan(0);
    expect(openAt).toBeLessThan(html.indexOf('<section class="board"'));
    const firstRow = /<table class="open">\s*<thead>[\s\S]*?<\/thead>\s*<tbody>\s*<tr>([\s\S]*?)<\/tr>/.exec(html)![1]!;
    expect(firstRow).toMatch(/Polarity.*fail/);
    // the cover says the revision was issued with open items accepted
    expect(html.slice(0, html.indexOf('id="summary"'))).toMatch(/Issued with open items accepted/);
  });

  it('refuses a job with errors, a bad date, and no --by', async () => {
    const root = place('refusals');
    const out = join(root, 'out');
    const broken = copyFixture('broken-job', root);
    const job = copyFixture('archive-job', root);
    const r = await issue(broken, out, '--date', '2026-10-10');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^broken-job\/project\.yaml:\d+:\d+: /);
    expect((await issue(job, out, '--date', '2026-02-30')).stderr).toMatch(/found issue date "2026-02-30"; expected a date as YYYY-MM-DD/);
    expect((await run(['issue', job, '--out', out, '--accept-open-items'])).code).toBe(2);
    expect(existsSync(out)).toBe(false);
    expect(existsSync(archiveOf(job))).toBe(false);
    expect(readdirSync(job).sort()).toEqual(['circuits.csv', 'project.yaml', 'readings']);
  });
});

describe('packsmith issue: concurrent runs', () => {
  it('two runs at the same moment never take the same number: the later one re-reads and takes the next', async () => {
    const root = place('race');
    const out = join(root, 'out');
    const a = copyFixture('archive-job', join(root, 'a'));
    const b = copyFixture('archive-job', join(root, 'b'));
    edit(b, 'readings/2026-10-09.csv', 'ok,0.58,', 'ok,0.61,');
    const archive = join(root, 'archive');
    const args = (job: string) => ['issue', job, '--by', 'T. Marwood', '--date', '2026-10-10', '--accept-open-items', '--out', out, '--archive', archive];
    const env = { PACKSMITH_STOP_AT: 'committing' };
    const runs = [startPacksmith(args(a), env), startPacksmith(args(b), env)];
    await Promise.all(runs.map((r) => r.said('stopped at committing'))); // both hold a finished rev-1, not yet in place
    await Promise.all(runs.map((r) => r.stopped()));
    for (const r of runs) r.child.kill('SIGCONT');
    const ends = await Promise.all(runs.map((r) => r.exit));
    expect(ends.map((e) => e.code)).toEqual([0, 0]);
    const numbers = ends.map((e) => Number(/issued Revision (\d+)/.exec(e.stdout)![1])).sort();
    expect(numbers).toEqual([1, 2]);
    // each job folder records the revision it issued, so the archive is checked against each alone
    expect((await run(['verify', archive])).code).toBe(0);
    const m2 = JSON.parse(readFileSync(join(archive, 'archive-job/rev-2/manifest.json'), 'utf8')) as Record<string, any>;
    expect(m2.previous.revision).toBe(1);
    expect(changesOf(readFileSync(join(archive, 'archive-job/rev-2/pack.html'), 'utf8')).headings).toEqual(['Changes since Revision 1', 'Readings changed']);
  });
});
