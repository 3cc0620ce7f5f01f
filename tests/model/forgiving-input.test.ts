// Loud and forgiving input: device hints, an ignore mapping for circuits.csv, tab-indented YAML.
import { afterAll, describe, expect, it } from 'vitest';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { deviceHint, guessDevice } from '../../src/model/device-hint.js';
import { readJob } from '../../src/load/job.js';
import { readYaml } from '../../src/load/yaml.js';
import { validate } from '../../src/model/validate.js';
import { formatError } from '../../src/load/raw.js';

const demo = fileURLToPath(new URL('../../projects/tannery-row-refit/', import.meta.url));
const tmp = mkdtempSync(join(tmpdir(), 'packsmith-input-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

function copyDemo(name: string): string {
  const dir = join(tmp, name);
  cpSync(demo, dir, { recursive: true });
  return dir;
}
const errorsOf = (dir: string): string[] => {
  const v = validate(readJob(dir));
  return v.ok ? [] : v.errors.map(formatError);
};

describe('device hints', () => {
  it.each([
    ['B32', 'mcb:B', 32],
    ['MCB B 32', 'mcb:B', 32],
    ['mcb b32', 'mcb:B', 32],
    ['Type C 20A', 'mcb:C', 20],
    ['C16 RCBO', 'rcbo:C', 16],
    ['RCBO B6', 'rcbo:B', 6],
    ['30A rewireable', 'fuse:bs3036', 30],
    ['BS3036 15A', 'fuse:bs3036', 15],
    ['semi-enclosed 45', 'fuse:bs3036', 45],
    ['BS88 63A', 'fuse:gG', 63],
    ['gG 32', 'fuse:gG', 32],
    ['BS 88-3 30A', 'fuse:bs88-3', 30],
    ['BS1361 45A', 'fuse:bs88-3', 45],
    ['MCB B', 'mcb:B', null],
  ])('reads "%s" as %s %s', (written, code, rating) => {
    expect(guessDevice(written)).toEqual({ codes: [code], rating });
  });

  it('asks for the curve letter when an MCB is written without one', () => {
    expect(deviceHint('32A MCB')).toContain('mcb:B, mcb:C or mcb:D (the curve letter printed on the device), rating_a 32');
  });

  it('gives no hint for what it does not recognise', () => {
    expect(guessDevice('isolator')).toBeNull();
    expect(deviceHint('16')).toBe('');
  });

  it('puts the hint in the input error; the row is still refused', () => {
    const dir = copyDemo('hint');
    const csv = readFileSync(join(dir, 'circuits.csv'), 'utf8').replace('DB1,3,Sockets shop floor,power,20,rcbo:B,32', 'DB1,3,Sockets shop floor,power,20,B32 RCBO,32');
    writeFileSync(join(dir, 'circuits.csv'), csv);
    const lines = errorsOf(dir);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^circuits\.csv:4:6: device: found "B32 RCBO"; expected a device code: .*; did you mean device rcbo:B, rating_a 32\?/);
  });
});

describe('circuits.columns', () => {
  it('ignores or renames a spreadsheet column named in project.yaml, and reports it otherwise', () => {
    const dir = copyDemo('columns');
    const csv = readFileSync(join(dir, 'circuits.csv'), 'utf8').split('\n');
    const extra = csv.map((l, i) => (l === '' ? l : `${l},${i === 0 ? 'Cable tag' : `T${i}`}`)).join('\n').replace(/^board,ref,description/, 'board,ref,Circuit description');
    writeFileSync(join(dir, 'circuits.csv'), extra);
    expect(errorsOf(dir).some((l) => l.includes('unknown column "Cable tag"'))).toBe(true);
    const yaml = readFileSync(join(dir, 'project.yaml'), 'utf8');
    writeFileSync(join(dir, 'project.yaml'), `${yaml}circuits:\n  columns:\n    Cable tag: ignore\n    Circuit description: description\n`);
    expect(errorsOf(dir)).toEqual([]);
    const v = validate(readJob(dir));
    expect(v.ok && v.project.circuits[0]!.description).toBe('Lighting shop floor');
  });
});

describe('YAML indented with tabs', () => {
  it('gives one error naming the lines and the cure', () => {
    const text = 'title: x\nsupply:\n\tearthing: TT\n\tu0_v: 230\nboards:\n\t- { id: DB1 }\n';
    const { doc, errors } = readYaml('project.yaml', text);
    expect(doc).toBeNull();
    expect(errors.map(formatError)).toEqual([
      'project.yaml:3:1: indented with a tab (lines 3, 4, 6); YAML is indented with spaces: replace each tab with two spaces, or set your editor to insert spaces',
    ]);
  });

  it('leaves a tab inside a value alone', () => {
    const { errors } = readYaml('project.yaml', 'title: "a\\tb"\nnotes: |\n  line\n');
    expect(errors).toEqual([]);
  });
});
