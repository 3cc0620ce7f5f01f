// Firm settings: the nearest packsmith.yaml above a job, merged under its project.yaml.
import { afterAll, describe, expect, it } from 'vitest';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { findFirmFile, readFirm } from '../../src/load/firm.js';
import { readJob } from '../../src/load/job.js';
import { jobArchiveSettings } from '../../src/archive/location.js';
import { validate } from '../../src/model/validate.js';
import { formatError } from '../../src/load/raw.js';

const demo = fileURLToPath(new URL('../../projects/tannery-row-refit/', import.meta.url));
const root = mkdtempSync(join(tmpdir(), 'packsmith-firm-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

/** The demo job without its installer, paper and rules: the firm gives those. */
function job(dir: string, edit: (yaml: string) => string = (y) => y): string {
  mkdirSync(dir, { recursive: true });
  cpSync(demo, dir, { recursive: true });
  const yaml = readFileSync(join(demo, 'project.yaml'), 'utf8')
    .replace(/installer:\n(  .*\n)+/, '')
    .replace(/rules:\n  set: iec-60364\n/, 'rules:\n  measured_zs_factor: 0.75\n');
  writeFileSync(join(dir, 'project.yaml'), edit(yaml));
  return dir;
}

const FIRM = `installer:
  firm: Brackenfold Electrical
  address: 9 Ropewalk, Millbrook
paper: Letter
rules:
  cmin: 0.9
readings:
  columns:
    Tester: tested_by
archive: issued
`;

describe('firm settings (packsmith.yaml)', () => {
  writeFileSync(join(root, 'packsmith.yaml'), FIRM);
  mkdirSync(join(root, '.git')); // the search stops at a repository root
  const plain = job(join(root, 'jobs', 'job-a'));

  it('is found in a folder above the job, the nearest first', () => {
    expect(findFirmFile(plain)).toBe(join(root, 'packsmith.yaml'));
    const nested = job(join(root, 'north', 'job-b'));
    writeFileSync(join(root, 'north', 'packsmith.yaml'), 'installer: { firm: North Office }\n');
    expect(findFirmFile(nested)).toBe(join(root, 'north', 'packsmith.yaml'));
    const v = validate(readJob(nested));
    expect(v.ok && v.project.file.installer.firm).toBe('North Office');
  });

  it('fills in what the job leaves out and merges objects field by field; the job wins', () => {
    const v = validate(readJob(plain));
    if (!v.ok) throw new Error(v.errors.map(formatError).join('\n'));
    const f = v.project.file;
    expect(f.installer.firm).toBe('Brackenfold Electrical');
    expect(f.paper).toBe('Letter');
    expect(f.rules.cmin).toBe(0.9); // from the firm
    expect(f.rules.measured_zs_factor).toBe(0.75); // from the job
    expect(f.readings.columns.Tester).toBe('tested_by'); // the firm's mapping
    expect(f.readings.columns['Zs (Ω)']).toBe('zs_ohm'); // and the job's own
  });

  it('lets a job override a firm value', () => {
    const over = job(join(root, 'jobs', 'job-c'), (y) => `${y}paper: A4\ninstaller: { firm: Site Partner Ltd }\n`);
    const v = validate(readJob(over));
    expect(v.ok && v.project.file.paper).toBe('A4');
    expect(v.ok && v.project.file.installer.firm).toBe('Site Partner Ltd');
    expect(v.ok && v.project.file.installer.address).toBe('9 Ropewalk, Millbrook'); // field by field
  });

  it('names the firm file and its line for a value that came from it', () => {
    const dir = join(root, 'bad');
    const j = job(join(dir, 'job-d'));
    writeFileSync(join(dir, 'packsmith.yaml'), 'installer: { firm: X }\npaper: A5\ntitle: every job\n');
    const v = validate(readJob(j));
    const lines = v.ok ? [] : v.errors.map(formatError);
    expect(lines).toContain('../packsmith.yaml:2:8: paper: found "A5"; expected the paper size: A4, Letter');
    expect(lines.some((l) => l.startsWith('../packsmith.yaml:3:8: title: unknown field'))).toBe(true);
    expect(lines.filter((l) => l.includes('paper')).length).toBe(1); // once, though checked as firm and job
  });

  it('is an input of the job, so a change to it changes the build fingerprint', () => {
    const raw = readJob(plain);
    expect(raw.files.get('../../packsmith.yaml')?.toString()).toBe(FIRM);
  });

  it('gives the archive folder and public key relative to itself (the same file the job settings come from)', () => {
    const firm = jobArchiveSettings(plain);
    expect(firm.firmFile).toBe(readFirm(plain)!.path);
    expect(firm.archive).toBe(join(root, 'issued'));
    expect(firm.publicKey).toBeNull();
    writeFileSync(join(root, 'north', 'packsmith.yaml'), 'public_key: keys/firm.pub\n');
    const north = jobArchiveSettings(join(root, 'north', 'job-b'));
    expect(north.firmFile).toBe(readFirm(join(root, 'north', 'job-b'))!.path);
    expect(north.archive).toBe(join(root, 'archive')); // no archive: given: archive/ beside the folder holding the jobs
    expect(north.publicKey).toBe(join(root, 'north', 'keys', 'firm.pub'));
  });

  it('takes a theme relative to the firm file', () => {
    const dir = join(root, 'themed');
    mkdirSync(join(dir, 'look'), { recursive: true });
    writeFileSync(join(dir, 'packsmith.yaml'), 'installer: { firm: X }\ntheme: look\n');
    const v = validate(readJob(job(join(dir, 'jobs', 'job-e'))));
    expect(v.ok && v.project.file.theme).toBe(join('..', '..', 'look'));
  });
});
