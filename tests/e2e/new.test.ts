// packsmith new: a job folder that validates as written, with the firm's settings inherited.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'yaml';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { run, ROOT } from '../helpers/cli.js';
import { CIRCUIT_REQUIRED } from '../../src/model/schema.js';

const tmp = mkdtempSync(join(tmpdir(), 'packsmith-new-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));
const demo = join(ROOT, 'projects/tannery-row-refit');

describe('packsmith new', () => {
  const job = join(tmp, 'jobs', 'mill-lane');
  let made: Awaited<ReturnType<typeof run>>;
  beforeAll(async () => { made = await run(['new', job]); });

  it('writes project.yaml, circuits.csv, an empty readings/ and notes.md', async () => {
    expect(made.code).toBe(0);
    expect(readdirSync(job).sort()).toEqual(['circuits.csv', 'notes.md', 'project.yaml', 'readings']);
    expect(readdirSync(join(job, 'readings'))).toEqual([]);
    expect(readFileSync(join(job, 'circuits.csv'), 'utf8')).toBe(`${CIRCUIT_REQUIRED.join(',')}\n`);
  });

  it('names the JSON Schema on the first line, by a path that exists from the job folder', async () => {
    const first = readFileSync(join(job, 'project.yaml'), 'utf8').split('\n')[0]!;
    const m = /^# yaml-language-server: \$schema=(.+)$/.exec(first);
    expect(m).not.toBeNull();
    expect(existsSync(join(job, m![1]!))).toBe(true);
  });

  it('passes check: no input errors, and exit 1 with every FILL IN listed until the values are given', async () => {
    const r = await run(['check', job]);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain('project.yaml:4:8: still marked FILL IN: title:');
    expect(r.stderr).toMatch(/still marked FILL IN: earthing: TN-C-S/);
    const project = parse(readFileSync(join(job, 'project.yaml'), 'utf8')) as unknown;
    const ajv = new Ajv2020({ strict: false });
    expect(ajv.validate(JSON.parse(readFileSync(join(ROOT, 'schema/project.schema.json'), 'utf8')) as object, project)).toBe(true);
  });

  it('checks clean once the values are filled in', async () => {
    const path = join(job, 'project.yaml');
    writeFileSync(path, readFileSync(path, 'utf8').replace(/FILL IN[^#\n]*?(?=\s*(#|\}|\n))/g, 'Given').replace(/#\s*FILL IN.*\n/, '\n'));
    const r = await run(['check', job]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
  });

  it('refuses to overwrite an existing folder', async () => {
    const r = await run(['new', job]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('already exists');
  });

  it('inherits the firm file (shown as comments, not copied) and takes the earlier job\'s circuits with --from', async () => {
    const firmDir = join(tmp, 'firm');
    mkdirSync(firmDir);
    writeFileSync(join(firmDir, 'packsmith.yaml'), 'installer:\n  firm: Brackenfold Electrical Ltd\npaper: Letter\n');
    const next = join(firmDir, 'next-job');
    const r = await run(['new', next, '--from', demo]);
    expect(r.code).toBe(0);
    const yaml = readFileSync(join(next, 'project.yaml'), 'utf8');
    expect(yaml).toContain('# From the firm file ../packsmith.yaml');
    expect(yaml).toContain('#     firm: Brackenfold Electrical Ltd');
    expect(yaml).not.toMatch(/^installer:/m);
    expect(readFileSync(join(next, 'circuits.csv'), 'utf8')).toBe(readFileSync(join(demo, 'circuits.csv'), 'utf8'));
    const c = await run(['check', next, '--json']);
    expect(c.code).toBe(1);
    expect((JSON.parse(c.stdout) as { circuits: unknown[] }).circuits.length).toBeGreaterThan(10);
  });

  it('says plainly when --from is not there', async () => {
    const r = await run(['new', join(tmp, 'other'), '--from', 'nope']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--from: packsmith: no job folder "nope"');
    expect(existsSync(join(tmp, 'other'))).toBe(false);
  });
});
