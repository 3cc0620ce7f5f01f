// Incremental builds and the archive site, with the compiled CLI.
import { afterAll, describe, expect, it } from 'vitest';
import { chmodSync, existsSync, readFileSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { dirname, join } from 'node:path';
import { run } from '../helpers/cli.js';
import { copyFixture, edit, removeTree, scratch } from '../helpers/archive.js';

const root = scratch('incremental');
afterAll(() => removeTree(root));
const a = copyFixture('archive-job', root);
const f = copyFixture('failing-job', root);
const out = join(root, 'out');
const build = (...more: string[]) => run(['build', a, f, '--out', out, ...more]);
const stamp = (job: string) => `${statSync(join(out, job, 'draft/pack.pdf')).mtimeMs}:${statSync(join(out, job, 'draft/pack.html')).mtimeMs}`;
const rebuilt = (r: { stdout: string }) => ['archive-job', 'failing-job'].filter((j) => r.stdout.includes(`${j}: ${join(out, j, 'draft/pack.pdf')}`));
const sha = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex');
const kept = (r: { stdout: string }) => [...r.stdout.matchAll(/^([\w-]+): unchanged/gm)].map((m) => m[1]);

describe('packsmith build, incrementally', () => {
  let before: string[];

  it('builds every job the first time', async () => {
    const r = await build();
    expect(r.code).toBe(0);
    expect(rebuilt(r)).toEqual(['archive-job', 'failing-job']);
    before = [stamp('archive-job'), stamp('failing-job')];
    // the draft's record names each file by the SHA-256 of its bytes as written (FIPS 180-4)
    for (const job of ['archive-job', 'failing-job']) {
      const draft = join(out, job, 'draft');
      const { outputs } = JSON.parse(readFileSync(join(draft, 'build.json'), 'utf8')) as { outputs: Record<string, string> };
      expect(outputs).toEqual({ 'pack.html': sha(join(draft, 'pack.html')), 'pack.pdf': sha(join(draft, 'pack.pdf')) });
    }
  });

  it('skips every job when nothing changed, leaving its files as they were', async () => {
    const r = await build();
    expect(r.code).toBe(0);
    expect(kept(r)).toEqual(['archive-job', 'failing-job']);
    expect([stamp('archive-job'), stamp('failing-job')]).toEqual(before);
  });

  it('re-renders and re-prints only the job whose inputs changed', async () => {
    edit(a, 'readings/2026-10-09.csv', 'ok,1.08,', 'ok,1.12,');
    const r = await build();
    expect(rebuilt(r)).toEqual(['archive-job']);
    expect(kept(r)).toEqual(['failing-job']);
    expect(stamp('failing-job')).toBe(before[1]);
  });

  it('rebuilds a job whose draft was altered, and everything with --force', async () => {
    writeFileSync(join(out, 'failing-job/draft/pack.html'), 'edited by hand');
    expect(rebuilt(await build())).toEqual(['failing-job']);
    expect(rebuilt(await build('--force'))).toEqual(['archive-job', 'failing-job']);
  });

  it('rebuilds a draft that other packsmith code built, though the version number is the same', async () => {
    const file = join(out, 'failing-job', 'draft', 'build.json');
    const stampJson = JSON.parse(readFileSync(file, 'utf8')) as { fingerprint: { packsmith: string } };
    expect(stampJson.fingerprint.packsmith).toMatch(/^\d+\.\d+\.\d+\+[0-9a-f]{12}$/); // the version and a hash of the code
    stampJson.fingerprint.packsmith = stampJson.fingerprint.packsmith.replace(/\+.*/, '+000000000000');
    writeFileSync(file, JSON.stringify(stampJson));
    const r = await build();
    expect(rebuilt(r)).toEqual(['failing-job']);
  });

  it('rebuilds a draft printed without Chromium once Chromium is there', async () => {
    const noChrome = await run(['build', f, '--out', out], { PACKSMITH_CHROME: '/nonexistent/chromium' });
    expect(noChrome.stdout).toContain('failing-job: unchanged'); // its PDF is there and still of these inputs
    edit(f, 'readings/2026-10-09.csv', 'ok,0.58,', 'ok,0.56,');
    const htmlOnly = await run(['build', f, '--out', out], { PACKSMITH_CHROME: '/nonexistent/chromium' });
    expect(htmlOnly.stderr).toMatch(/No Chromium found/);
    expect(existsSync(join(out, 'failing-job/draft/pack.pdf'))).toBe(false); // never a PDF of other inputs
    expect(rebuilt(await build())).toEqual(['failing-job']);
    expect(existsSync(join(out, 'failing-job/draft/pack.pdf'))).toBe(true);
  });

  it('rebuilds the draft when a revision is issued, and the draft then shows the changes since it', async () => {
    expect((await run(['issue', a, '--by', 'T. Marwood', '--date', '2026-10-12', '--accept-open-items', '--out', out])).code).toBe(0);
    expect(rebuilt(await build())).toEqual(['archive-job']);
    let html = readFileSync(join(out, 'archive-job/draft/pack.html'), 'utf8');
    expect(html).toContain('<h2>Changes since Revision 1</h2>');
    expect(html).toContain('No circuit, reading, verdict or design value changed.');
    edit(a, 'readings/2026-10-09.csv', 'ok,0.64,', 'ok,0.66,');
    await build();
    html = readFileSync(join(out, 'archive-job/draft/pack.html'), 'utf8');
    expect(html).toMatch(/<td>DB1<\/td><td>2<\/td><td>Measured Zs<\/td><td>0\.64 Ω on 2026-10-09<\/td><td>0\.66 Ω on 2026-10-09<\/td>/);
  });
});

describe('what a rebuild looks at', () => {
  const mtime = (p: string) => statSync(p).mtimeMs;

  it('finds a changed reading by its content, though its size and time are as before', async () => {
    const file = join(f, 'readings/2026-10-09.csv');
    const when = new Date('2026-10-12T12:00:00Z');
    utimesSync(file, when, when);
    const was = statSync(file);
    edit(f, 'readings/2026-10-09.csv', 'ok,0.56,', 'ok,0.57,'); // same length
    utimesSync(file, when, when);
    expect([statSync(file).size, statSync(file).mtimeMs]).toEqual([was.size, was.mtimeMs]);
    expect(rebuilt(await build())).toEqual(['failing-job']);
  });

  it('rewrites the page of the job it rebuilt and the index, not the pages of the others', async () => {
    const page = (j: string) => join(out, j, 'index.html');
    const before = [mtime(page('archive-job'))];
    edit(f, 'readings/2026-10-09.csv', 'ok,0.57,', 'ok,0.58,');
    expect(rebuilt(await build())).toEqual(['failing-job']);
    expect(mtime(page('archive-job'))).toBe(before[0]); // a page is written only where it differs
    expect(readFileSync(join(out, 'index.html'), 'utf8').split('<tr data-date=')).toHaveLength(3);
  });

  it('does not re-hash an issued revision whose files keep their size and time; verify does, and finds the altered byte', async () => {
    const pdf = join(root, 'archive/archive-job/rev-1/pack.pdf');
    const when = new Date('2026-10-12T12:00:00Z'); // a time that survives setting it exactly
    chmodSync(pdf, 0o644);
    utimesSync(pdf, when, when);
    await build(); // the build hashes the file again, its time being new, and remembers it
    const was = statSync(pdf);
    const bytes = readFileSync(pdf);
    bytes[bytes.length >> 1] = bytes[bytes.length >> 1]! ^ 1;
    writeFileSync(pdf, bytes);
    utimesSync(pdf, when, when);
    await build('--force');
    expect(readFileSync(join(out, 'archive-job/index.html'), 'utf8')).not.toMatch(/finding/); // the build took the hash it knew
    const v = await run(['verify', join(root, 'projects')]);
    expect(v.code).toBe(1);
    expect(v.stdout).toMatch(/rev-1\/pack\.pdf: altered/);
    utimesSync(pdf, was.atime, new Date(was.mtimeMs + 1000)); // a file touched since: hashed again, and the site says so
    await build();
    expect(readFileSync(join(out, 'archive-job/index.html'), 'utf8')).toMatch(/1 finding\(s\): run packsmith verify/);
    bytes[bytes.length >> 1] = bytes[bytes.length >> 1]! ^ 1;
    writeFileSync(pdf, bytes);
    utimesSync(pdf, when, when);
    await build();
    expect(readFileSync(join(out, 'archive-job/index.html'), 'utf8')).not.toMatch(/finding/);
  });
});

describe('the archive site', () => {
  const page = (p: string) => readFileSync(join(out, p), 'utf8');
  const hrefs = (html: string) => [...html.matchAll(/href="([^"]+)"/g)].map((m) => m[1]!);

  it('lists every job with its client, site, latest revision and date, and status counts', async () => {
    const index = page('index.html');
    const rows = index.split('<tr data-date=').slice(1);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatch(/^"2026-10-12"[\s\S]*Lantern Yard workshop additions[\s\S]*Revision 1<\/td>\s*<td class="date">2026-10-12<\/td>[\s\S]*all passed/);
    expect(rows[1]).toMatch(/Draft only[\s\S]*open items \(draft\)[\s\S]*1 fail/);
  });

  it('links every revision and draft by relative paths that exist; the index has one inline script that makes no request', async () => {
    for (const p of ['index.html', 'archive-job/index.html', 'failing-job/index.html']) {
      const html = page(p);
      const scripts = [...html.matchAll(/<script([^>]*)>([\s\S]*?)<\/script>/gi)];
      expect(scripts, p).toHaveLength(p === 'index.html' ? 1 : 0);
      for (const [, attrs, code] of scripts) {
        expect(attrs).toBe(''); // inline, no src
        expect(code).not.toMatch(/fetch|XMLHttpRequest|import|https?:|WebSocket|location/);
      }
      for (const h of hrefs(html)) {
        expect(h).not.toMatch(/^(\/|[a-z]+:)/); // relative: works from file:// and from any web server
        expect(existsSync(join(out, dirname(p), h))).toBe(true);
      }
    }
    // the revisions stay in the archive beside projects/; the site in out/ links them there
    expect(hrefs(page('index.html'))).toEqual(expect.arrayContaining(['./archive-job/../../archive/archive-job/rev-1/pack.html', './archive-job/../../archive/archive-job/rev-1/pack.pdf', './failing-job/draft/pack.pdf']));
    expect(hrefs(page('archive-job/index.html'))).toEqual(['../index.html', './../../archive/archive-job/rev-1/pack.html', './../../archive/archive-job/rev-1/pack.pdf', './draft/pack.html', './draft/pack.pdf']);
    expect(existsSync(join(out, 'archive-job', 'rev-1'))).toBe(false);
  });
});
