// The record of what each page of the archive site was rendered from (out/.site-pages.json): a
// build renders again only the pages whose input changed, and never takes a page as current on the
// record's word alone: a page whose size or time differs, or any record that is missing, corrupt
// or of other code, means the page is rendered again.
import { afterAll, describe, expect, it } from 'vitest';
import { readFileSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { build } from '../../src/build.js';
import { SITE_PAGES_FILE } from '../../src/archive/site-pages.js';
import { copyFixture, edit, removeTree, scratch } from '../helpers/archive.js';

const root = scratch('site-pages');
afterAll(() => removeTree(root));
const a = copyFixture('archive-job', root);
const f = copyFixture('failing-job', root);
const out = join(root, 'out');
const quiet = { isTTY: false, write: () => true };
const once = () => build({ jobs: [a, f], out, printer: null, progress: quiet, log: () => {} });
const page = (job: string) => join(out, job, 'index.html');
const when = new Date('2026-10-12T12:00:00Z'); // a time that survives setting it exactly
const record = () => JSON.parse(readFileSync(join(out, SITE_PAGES_FILE), 'utf8')) as { pages: Record<string, [string, number, number]> };

/** The job page of archive-job altered by hand, keeping its size and time: only a record trusted blindly would leave it so. */
function alterKeepingSizeAndTime(): string {
  const text = readFileSync(page('archive-job'), 'utf8');
  const altered = text.replace('completion packs</title>', 'completion packZ</title>');
  expect(altered).not.toBe(text);
  writeFileSync(page('archive-job'), altered);
  utimesSync(page('archive-job'), when, when);
  return text;
}

describe('the record of the site pages', () => {
  it('records every page with the hash of its input and its size and time as written', async () => {
    await once();
    utimesSync(page('archive-job'), when, when);
    await once(); // the page's time differs from the record: rendered again (same text, so not rewritten), its new time recorded
    const r = record();
    expect(Object.keys(r.pages).sort()).toEqual(['archive-job/index.html', 'failing-job/index.html', 'index.html']);
    expect(r.pages['archive-job/index.html']!.slice(1)).toEqual([statSync(page('archive-job')).size, when.getTime()]);
  });

  it('renders again only the pages whose input changed: the job retitled and the index', async () => {
    const before = record().pages;
    edit(f, 'project.yaml', 'title: Lantern Yard workshop additions', 'title: Lantern Yard workshop, more additions');
    await once();
    const after = record().pages;
    expect(after['archive-job/index.html']).toEqual(before['archive-job/index.html']);
    expect(after['failing-job/index.html']![0]).not.toBe(before['failing-job/index.html']![0]);
    expect(after['index.html']![0]).not.toBe(before['index.html']![0]);
    expect(readFileSync(page('failing-job'), 'utf8')).toContain('Lantern Yard workshop, more additions');
    expect(readFileSync(join(out, 'index.html'), 'utf8')).toContain('Lantern Yard workshop, more additions');
  });

  it('takes a page whose input, size and time are as recorded as current, without rendering it', async () => {
    const text = alterKeepingSizeAndTime();
    await once();
    expect(readFileSync(page('archive-job'), 'utf8')).not.toBe(text);
    writeFileSync(page('archive-job'), text);
    utimesSync(page('archive-job'), when, when);
  });

  it('renders again a page altered by hand (its size or time differs from the record)', async () => {
    const text = readFileSync(page('archive-job'), 'utf8');
    writeFileSync(page('archive-job'), `${text}<!-- altered -->`);
    await once();
    expect(readFileSync(page('archive-job'), 'utf8')).toBe(text);
  });

  it.each([
    ['missing', () => rmSync(join(out, SITE_PAGES_FILE))],
    ['not JSON', () => writeFileSync(join(out, SITE_PAGES_FILE), '{"format": "packsmith-site-pages/1", "pag')],
    ['of other code', () => writeFileSync(join(out, SITE_PAGES_FILE), JSON.stringify({ ...record(), renderer: 'other' }))],
    ['of another shape', () => writeFileSync(join(out, SITE_PAGES_FILE), JSON.stringify({ ...record(), pages: { 'archive-job/index.html': 'yes' } }))],
  ])('renders every page again when the record is %s', async (_, spoil) => {
    utimesSync(page('archive-job'), when, when);
    await once(); // the record has the page at this time
    const text = alterKeepingSizeAndTime();
    spoil();
    await once();
    expect(readFileSync(page('archive-job'), 'utf8')).toBe(text);
    expect(Object.keys(record().pages)).toHaveLength(3);
  });
});
