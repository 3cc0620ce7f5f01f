// The hot partials have two copies: the templates (templates/partials/board.hbs, tree*.hbs,
// appendix.hbs, summary.hbs, status.hbs, symbol.hbs) and their TypeScript copies in
// src/render/native/. The engine uses the copies where the theme replaces none of those files.
// Both must give the same bytes: every pack here is rendered both ways and compared whole, so a
// change made to one copy and not to the other fails.
import { describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadJob, type LoadedJob } from '../../src/job.js';
import { createEngine } from '../../src/render/engine.js';
import { renderPackFiles, themeAssets } from '../../src/render/pack.js';
import { buildView, type Changes, type RenderOptions } from '../../src/render/view.js';
import { generateArchive } from '../../src/bench/generate.js';

type Ok = Extract<LoadedJob, { ok: true }>;

const CHANGES: Changes = {
  since: { revision: 2, date: '2026-01-02' },
  issued: { by: 'A. <Issuer> & Co', date: '2026-02-03', reason: 'because "x" > y' },
  circuitsAdded: [{ board: 'DB1', ref: '9', description: 'New <circuit>' }],
  circuitsRemoved: [],
  design: [],
  readings: [{ board: 'DB1', ref: '1', field: 'zs_ohm', before: '0.5', after: '0.7' }],
  verdicts: [{ board: 'DB1', ref: '1', check: 'zs-measured', before: 'pass', after: 'fail' }],
  job: [],
  lateSessions: [],
};
const OPTIONS: RenderOptions[] = [
  { revisionLabel: 'DRAFT', draft: true, date: '2026-01-23' },
  { revisionLabel: 'Revision 3', draft: false, date: '2026-02-03', paper: 'Letter', changes: CHANGES, acceptedOpenItems: true, signingKeyFingerprint: 'SHA256:abc' },
];

const loaded = (dir: string): Ok | null => {
  const j = loadJob(dir);
  return j.ok ? j : null;
};
const folders = (root: string) => readdirSync(root).sort().map((n) => join(root, n)).filter((d) => existsSync(join(d, 'project.yaml')));

const templates = createEngine({ native: false });
const natives = createEngine();

function sameBothWays(job: Ok, opts: RenderOptions): void {
  const a = renderPackFiles(job.project, job.assessment, opts, templates);
  const b = renderPackFiles(job.project, job.assessment, opts, natives);
  expect(b.html.length).toBeGreaterThan(1000);
  expect(b.html).toBe(a.html);
  expect(b.header).toBe(a.header);
  expect(b.footer).toBe(a.footer);
}

/** Every string of the view with the characters Handlebars escapes added, for a pack of hostile text. */
function hostile(value: unknown, key = ''): unknown {
  if (typeof value === 'string') return key === 'css' || key === 'snippetSvg' || key === 'notesHtml' ? value : `${value} &<>"'\`=`;
  if (Array.isArray(value)) return value.map((v) => hostile(v));
  if (value !== null && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, hostile(v, k)]));
  return value;
}

/** The view with every number 0 and every array after the first element cut, for the edges of {{#if}} and {{num}}. */
function zeroed(value: unknown): unknown {
  if (typeof value === 'number') return 0;
  if (Array.isArray(value)) return value.slice(0, 1).map(zeroed);
  if (value !== null && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, zeroed(v)]));
  return value;
}

/** The view with one field of every status look changed, its status kept: the native partials write the usual looks once. */
function relooked(value: unknown, field: string): unknown {
  if (Array.isArray(value)) return value.map((v) => relooked(v, field));
  if (value === null || typeof value !== 'object') return value;
  const o: Record<string, unknown> = Object.fromEntries(Object.entries(value).map(([k, v]) => [k, relooked(v, field)]));
  return 'status' in o && 'css' in o && 'shape' in o ? { ...o, [field]: `${String(o[field])}"x` } : o;
}

describe('the native partials', () => {
  it('are used with the built-in templates and with a theme that replaces none of them', () => {
    expect(natives.native).toBe(true);
    expect(templates.native).toBe(false);
    expect(createEngine({ theme: 'themes/fenwick-lane' }).native).toBe(true);
  });

  it('give the bytes of the templates for every demo job and fixture, draft and revision', () => {
    const jobs = [...folders('projects'), ...folders('tests/fixtures')].map(loaded).filter((j): j is Ok => j !== null);
    expect(jobs.length).toBeGreaterThanOrEqual(10);
    for (const job of jobs) for (const opts of OPTIONS) sameBothWays(job, opts);
  });

  it('give the bytes of the templates for generated jobs', () => {
    const root = mkdtempSync(join(tmpdir(), 'packsmith-native-'));
    try {
      const gen = generateArchive(root, 12, 11, { circuits: [1, 60], boards: [1, 4] });
      for (const dir of gen.jobs) sameBothWays(loaded(dir)!, OPTIONS[0]!);
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });

  it('escape and test values exactly as Handlebars does: hostile text, zeros, single rows', () => {
    for (const dir of ['tests/fixtures/pack-job', 'tests/fixtures/tree-three-level', 'projects/marsh-street-surgery']) {
      const job = loaded(dir)!;
      const view = buildView(job.project, job.assessment, OPTIONS[1]!, themeAssets(templates));
      for (const [v, escaped] of [[hostile(view), true], [zeroed(view), false], [zeroed(hostile(view)), true]] as const) {
        const html = natives.render('pack.hbs', v);
        if (escaped) expect(html).toContain('&amp;&lt;&gt;&quot;&#x27;&#x60;&#x3D;');
        expect(html).toBe(templates.render('pack.hbs', v));
      }
    }
  });

  it('write a status look that differs from the usual one in any field as it is', () => {
    const job = loaded('tests/fixtures/pack-job')!;
    const view = buildView(job.project, job.assessment, OPTIONS[0]!, themeAssets(templates));
    const usual = natives.render('pack.hbs', view);
    for (const field of ['css', 'shape', 'symbol', 'word']) {
      const v = relooked(view, field);
      const html = natives.render('pack.hbs', v);
      expect(html).not.toBe(usual);
      expect(html).toBe(templates.render('pack.hbs', v));
    }
  });

  it('give way to the templates where a theme replaces one of their partials or pack.hbs', () => {
    for (const name of ['partials/status.hbs', 'partials/board.hbs', 'partials/tree-cells.hbs', 'pack.hbs']) {
      const dir = mkdtempSync(join(tmpdir(), 'packsmith-theme-'));
      mkdirSync(join(dir, 'partials'));
      const source = name === 'pack.hbs'
        ? '<html><head></head><body>THEMED {{> summary}}{{#each boards}}{{> board}}{{/each}}{{> appendix}}</body></html>'
        : `THEMED ${name}`;
      writeFileSync(join(dir, name), source);
      const engine = createEngine({ theme: dir });
      expect(engine.native).toBe(false);
      const job = loaded('tests/fixtures/pack-job')!;
      expect(renderPackFiles(job.project, job.assessment, OPTIONS[0]!, engine).html).toContain('THEMED');
    }
  });
});
