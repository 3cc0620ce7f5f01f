// Plain words for the reader: one table of labels covers every check, column and derived value
// (those agreed for later included); the pack shows no field ids, check ids or internal file
// names; and every comparison it prints reads true.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadJob } from '../../src/job.js';
import { CHECK_IDS } from '../../src/calc/types.js';
import { CIRCUIT_COLUMNS, READING_COLUMNS } from '../../src/model/schema.js';
import { CHECK_LABELS, CIRCUIT_LABELS, DERIVED_LABELS, JOB_LABELS, READING_LABELS, checkLabel, jobFieldLabel, plainWords, plainWordsOf } from '../../src/render/labels.js';
import { renderPack } from '../../src/render/pack.js';
import { comparison } from '../../src/render/values.js';
import { DERIVED_FIELDS } from '../../src/render/view.js';
import { assessmentText } from '../../src/render/text.js';

const JOBS = ['projects/tannery-row-refit', 'projects/marsh-street-surgery', 'projects/heronsgate-pottery', 'tests/fixtures/pack-job', 'tests/fixtures/failing-job',
  'tests/fixtures/tt-instrument-job', 'tests/fixtures/worked-example', 'tests/fixtures/long-board'];
const loaded = JOBS.map((dir) => {
  const j = loadJob(dir);
  if (!j.ok) throw new Error(`${dir} invalid`);
  return j;
});
const OPTS = { revisionLabel: 'DRAFT', draft: true, date: '2026-03-06' };

/** What a reader sees of a pack: its text, without markup, styles or the SVG's code. */
const visible = (html: string) => html.replace(/<style[\s\S]*?<\/style>/g, '').replace(/<title>[\s\S]*?<\/title>/g, '')
  .replace(/<[^>]+>/g, ' ').replace(/&#x3D;/g, '=').replace(/&gt;/g, '>').replace(/&lt;/g, '<').replace(/&amp;/g, '&');

describe('the labels table', () => {
  it('names every check, the agreed later ones included (CONTRACT.md)', () => {
    for (const id of [...CHECK_IDS, 'additional-protection', 'cpc-size', 'selectivity']) expect(CHECK_LABELS[id], id).toBeTruthy();
  });

  it('names every column of circuits.csv and readings/*.csv and every derived value, the agreed later ones included', () => {
    for (const c of CIRCUIT_COLUMNS) expect(CIRCUIT_LABELS[c], c).toBeTruthy();
    for (const c of ['sockets', 'outdoors', 'concealed', 'rcd_exemption', 'cpc_protected', 'let_through_a2s', 'device_ia_a']) expect(CIRCUIT_LABELS[c], c).toBeTruthy();
    for (const c of READING_COLUMNS.filter((c) => c !== 'board' && c !== 'ref')) expect(READING_LABELS[c], c).toBeTruthy();
    for (const d of [...DERIVED_FIELDS, 'zdb_ohm', 'pfc_ka', 'vd_origin_percent', 'max_length_m', 'fault_current_max_a']) expect(DERIVED_LABELS[d], d).toBeTruthy();
  });

  it('gives a field nobody named yet words rather than its id', () => {
    expect(checkLabel('earth-electrode')).toBe('Earth electrode');
    expect(jobFieldLabel('boards[1].location').label).toBe('Board 2: board location');
    expect(jobFieldLabel('supply.ze_ohm')).toEqual({ label: 'Ze', unit: 'Ω' });
    expect(jobFieldLabel('supply.new_thing_ohm')).toEqual({ label: 'Supply new thing', unit: 'Ω' });
  });

  it('turns field ids and internal file names in a basis into words', () => {
    expect(plainWords('6 kA, the usual capacity of fuse:bs3036 (breaking_ka not given)')).toBe('6 kA, the usual capacity of fuse:bs3036 (breaking capacity of the device not given)');
    expect(plainWords('no measured Ze (supply.ze_ohm) or Zdb')).toBe('no measured Ze (Ze) or Zdb');
    expect(plainWords('BS 7671 Table 41.2 (REFERENCE.md): 230 V')).toBe('BS 7671 Table 41.2: 230 V');
  });
});

describe('plain words without a pass of each replacement', () => {
  // plainWords gives a text holding none of the names a replacement looks for back as it is: it
  // must give what the full replacement gives, for any text.
  const ids = [...Object.keys(READING_LABELS), ...Object.keys(CIRCUIT_LABELS), ...Object.keys(DERIVED_LABELS), ...Object.keys(JOB_LABELS)];
  const pieces = [...ids, 'REFERENCE.md', '(REFERENCE.md)', '(see REFERENCE.md)', ' (from REFERENCE.md)', 'project.yaml', 'circuits.csv', 'set in project.yaml',
    'in circuits.csv', 'circuits.csv gives', '_', 'x_', '_y', 'a_b', 'supply.', 'rules.', 'boards.', 'client.', 'site.', 'installer.', 'dates.', 'signoff.',
    'Supply.ze', 'supplyx.ze', 'REFERENCE.MD', 'project.yml', 'circuits_csv', 'rules', 'supply', '.', ' ', '', 'é', 'Zs = 0.8 Ω ≤ 1.09 Ω', '(', ')', '\n', 'A2', 'ze'];
  const text = fc.array(fc.tuple(fc.constantFrom(...pieces), fc.constantFrom('', ' ', ' ')), { maxLength: 7 }).map((ps) => ps.map(([p, s]) => p + s).join(''));

  it('gives what the full replacement gives, for basis lines and for texts made of the names it replaces', () => {
    const seen = { changed: 0, same: 0 };
    const same = (t: string) => {
      const full = plainWordsOf(t);
      seen[full === t ? 'same' : 'changed']++;
      expect(plainWords(t), JSON.stringify(t)).toBe(full);
    };
    for (const { assessment } of loaded) {
      for (const c of assessment.circuits) for (const k of c.checks) [k.basis, k.remedy ?? ''].forEach(same);
      for (const d of assessment.departures) same(d.basis);
    }
    fc.assert(fc.property(text, (t) => same(t)), { numRuns: 20000 });
    // the texts take both paths, often
    expect(seen.changed).toBeGreaterThan(5000);
    expect(seen.same).toBeGreaterThan(5000);
  });
});

describe('the pack in plain words', () => {
  it('shows no field id, check id or internal file name anywhere a reader looks', () => {
    for (const { project, assessment } of loaded) {
      const text = visible(renderPack(project, assessment, OPTS));
      expect(text, project.name).not.toMatch(/REFERENCE\.md|project\.yaml|circuits\.csv/);
      expect(text.match(/\b[a-z][a-z0-9]*(?:_[a-z0-9]+)+\b/g) ?? [], project.name).toEqual([]);
      for (const id of CHECK_IDS.filter((id) => id.includes('-'))) expect(text, `${project.name}: ${id}`).not.toContain(id);
      expect(text, project.name).not.toMatch(/\(ring\)\s*\(ring\)/);
    }
  });

  it('prints no id in the terminal either, unless asked for JSON', () => {
    for (const { assessment } of loaded.slice(0, 2)) {
      for (const text of [assessmentText(assessment), assessmentText(assessment, { explain: true })]) {
        expect(text.match(/\b[a-z][a-z0-9]*(?:_[a-z0-9]+)+\b/g) ?? []).toEqual([]);
        expect(text).not.toContain('REFERENCE.md');
      }
    }
  });

  // A number, a comparison and a number of the same unit with only words between them
  // ("R1+R2 0.2 Ω ≤ expected 0.195 Ω") must be true as written.
  const PAIR = /(>?)(\d+(?:\.\d+)?) (Ω|MΩ|kA|A|%|ms|s|mm²|V) (≤|<|≥|>) (?:[A-Za-z][A-Za-z ]* )?(\d+(?:\.\d+)?) \3(?![\w²])/g;
  const holds = (a: number, op: string, b: number, lowerBound: boolean) =>
    op === '≤' ? a <= b && !lowerBound : op === '<' ? a < b && !lowerBound : op === '≥' ? a >= b : a > b || (lowerBound && a >= b);

  it('states every comparison so that it reads true: in every basis, and in the one-line form of a passing check', () => {
    let seen = 0;
    for (const { assessment } of loaded) {
      for (const c of assessment.circuits) {
        for (const k of c.checks) {
          for (const text of [plainWords(k.basis), comparison(k) ?? '']) {
            for (const m of text.matchAll(PAIR)) {
              seen++;
              expect(holds(Number(m[2]), m[4]!, Number(m[5]), m[1] === '>'), `${c.board} ${c.ref} ${k.id}: "${m[0]}" in "${text}"`).toBe(true);
            }
          }
        }
      }
    }
    expect(seen).toBeGreaterThan(100);
  });

  it('compares a passing check in one line, the sign chosen by the numbers', () => {
    const base = { id: 'zs-measured' as const, status: 'pass' as const, unit: 'ohm', basis: '' };
    expect(comparison({ ...base, value: 0.54, limit: 1.093 })).toBe('measured Zs 0.54 Ω ≤ limit 1.09 Ω');
    expect(comparison({ ...base, id: 'insulation', unit: 'Mohm', value: 999, limit: 1, over_range: true })).toBe('lowest reading >999 MΩ ≥ minimum 1 MΩ');
    // an over-range reading below its limit cannot be compared: no sign
    expect(comparison({ ...base, value: 0.5, limit: 1, over_range: true })).toBe('measured Zs >0.5 Ω; limit 1 Ω');
    expect(comparison({ ...base, id: 'polarity', value: null, limit: null })).toBeNull();
  });
});
