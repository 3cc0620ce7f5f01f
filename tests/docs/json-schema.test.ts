// The editors' JSON Schemas, checked with a JSON Schema validator (ajv): every demo and fixture
// project.yaml is accepted, broken ones are refused.
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { parse } from 'yaml';

const root = fileURLToPath(new URL('../../', import.meta.url));
const schema = (name: string) => JSON.parse(readFileSync(join(root, 'schema', name), 'utf8')) as object;
const ajv = new Ajv2020({ allErrors: true, strict: false });
const project = ajv.compile(schema('project.schema.json'));
const firm = ajv.compile(schema('firm.schema.json'));

const jobs = ['projects', 'tests/fixtures'].flatMap((d) => readdirSync(join(root, d)).map((n) => join(root, d, n)))
  .filter((d) => existsSync(join(d, 'project.yaml')) && !d.endsWith('broken-job'));
const demo = () => parse(readFileSync(join(root, 'projects/tannery-row-refit/project.yaml'), 'utf8')) as Record<string, any>;

describe('schema/project.schema.json', () => {
  it.each(jobs.map((j) => [j.slice(root.length)]))('accepts %s/project.yaml', (j) => {
    const ok = project(parse(readFileSync(join(root, j, 'project.yaml'), 'utf8')));
    expect(project.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
  });

  it('accepts a number with a unit where a number goes ("0.28 Ω", "230 V")', () => {
    const d = demo();
    d.supply.ze_ohm = '0.28 Ω';
    d.supply.u0_v = '230V';
    expect(project(d)).toBe(true);
  });

  it.each([
    ['a misspelled field', (d: any) => { d.supply.ze_ohms = 0.2; }],
    ['an unknown earthing system', (d: any) => { d.supply.earthing = 'TN-Z'; }],
    ['a missing title', (d: any) => { delete d.title; }],
    ['a unit of another quantity', (d: any) => { d.supply.ze_ohm = '0.28 V'; }],
    ['a decimal comma', (d: any) => { d.supply.ze_ohm = '0,28'; }],
    ['a negative resistance', (d: any) => { d.supply.ze_ohm = -0.2; }],
    ['a Cmin above 1.1', (d: any) => { d.rules.cmin = 1.5; }],
    ['an empty board list', (d: any) => { d.boards = []; }],
    ['a readings column mapped to nothing packsmith reads', (d: any) => { d.readings.columns.Serial = 'serial'; }],
  ])('refuses %s', (_what, edit) => {
    const d = demo();
    edit(d);
    expect(project(d)).toBe(false);
  });

  it('also refuses the broken fixture job', () => {
    expect(project(parse(readFileSync(join(root, 'tests/fixtures/broken-job/project.yaml'), 'utf8')))).toBe(false);
  });
});

describe('schema/firm.schema.json', () => {
  it('accepts firm settings and refuses a job-only field', () => {
    expect(firm({ installer: { firm: 'Brackenfold Electrical' }, paper: 'Letter', rules: { cmin: 0.95 }, archive: 'archive', public_key: 'keys/firm.pub' })).toBe(true);
    expect(firm({ title: 'every job' })).toBe(false);
    expect(firm({ paper: 'A5' })).toBe(false);
  });
});
