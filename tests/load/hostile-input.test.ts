// The reproducers of broken and hostile input: each was accepted (or crashed) before and is now a
// located input error. Every one is a real job folder, the demo with one thing broken.
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, renameSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { demoCopy, errorsOf, replaceIn, write } from '../helpers/job.js';
import { jobInputFiles, readJob } from '../../src/load/job.js';
import { build } from '../../src/build.js';
import { validate } from '../../src/model/validate.js';
import { assess } from '../../src/calc/assess.js';
import { CALC_RULES } from '../../src/calc/inputs.js';
import { BoardSchema, MEASURED, SupplySchema } from '../../src/model/schema.js';
import { PLAUSIBLE } from '../../src/reference/plausibility.js';
import { archiveSettings } from '../../src/archive/location.js';

const LOCATED = /^[^:]+:\d+:\d+: \S/;
const RETEST = 'readings/2026-11-20-retest.csv';
const RETEST_ROW = 'DB1,10,1.07,1.39,>999,>999,500,ok,R. Okafor,cpc remade at the sign transformer and re-tested';

function only(job: string, start: string): string[] {
  const errors = errorsOf(job);
  expect(errors.every((e) => LOCATED.test(e))).toBe(true);
  expect(errors.filter((e) => e.startsWith(start)), errors.join('\n')).not.toHaveLength(0);
  return errors;
}

describe('the CSV reader is strict', () => {
  it('refuses a short readings row rather than letting the earlier session fill it in', () => {
    const job = demoCopy();
    write(job, 'readings/2026-11-21.csv', 'board,ref,r1r2_ohm,polarity,rcd_1x_ms,rcd_5x_ms\nDB1,3,0.23\n');
    only(job, 'readings/2026-11-21.csv:2:3: this row has 3 cells but the header names 6 columns');
  });
  it('refuses a circuits row cut before rcd_ma', () => {
    const job = demoCopy();
    replaceIn(job, 'circuits.csv', 'DB1,3,Sockets shop floor,power,20,rcbo:B,32,2.5,1.5,46,C,1,30,A,yes,1,yes,6,16000,,,', 'DB1,3,Sockets shop floor,power,20,rcbo:B,32,2.5,1.5,46,C,1');
    only(job, 'circuits.csv:4:12: this row has 12 cells but the header names');
  });
  it('refuses a stray quote that would swallow the rows after it', () => {
    const job = demoCopy();
    write(job, 'readings/2026-11-21.csv', 'board,ref,polarity,notes\nDB1,1,fail,"loose\nDB1,2,fail,x\nDB1,3,fail,y"\nDB1,4,fail,z\n');
    only(job, 'readings/2026-11-21.csv:2:4: this cell runs over 3 lines');
  });
  it('locates a quote that is never closed where it opens', () => {
    const job = demoCopy();
    write(job, 'readings/2026-11-21.csv', 'board,ref,polarity,notes\nDB1,1,fail,x\nDB1,2,fail,"never closed\nDB1,3,fail,y\n');
    only(job, 'readings/2026-11-21.csv:3:12: a quote opens this cell and is never closed');
  });
  it('does not overflow the stack when a file yields hundreds of thousands of errors', () => {
    const job = demoCopy();
    // each row one cell too many: one reader error per row (spread into push(), these overflowed the stack)
    write(job, 'readings/2026-11-21.csv', `board,ref,zs_ohm\n${'DB1,1,0.5,x\n'.repeat(140_000)}`);
    const errors = only(job, 'readings/2026-11-21.csv:2:4: this row has 4 cells but the header names 3 columns');
    expect(errors.length).toBeLessThan(1000);
    expect(errors.some((e) => /and \d+ more problem/.test(e))).toBe(true);
  }, 600_000); // 140,000 rows to read: a limit for a busy machine, not a timing
});

describe('every file in readings/ is a test session', () => {
  it('refuses a session saved as .csv.txt instead of skipping it', () => {
    const job = demoCopy();
    write(job, 'readings/2026-11-21-retest.csv.txt', 'board,ref,polarity\nDB1,1,fail\n');
    only(job, 'readings/2026-11-21-retest.csv.txt:1:1: not named .csv');
  });
  it('refuses a workbook in readings/ and says to save it as CSV', () => { // issue 14 point 5
    const job = demoCopy();
    write(job, 'readings/2026-11-23.xlsx', Buffer.from('PK\x03\x04 workbook', 'latin1'));
    const [e] = only(job, 'readings/2026-11-23.xlsx:1:1: a spreadsheet workbook');
    expect(e).toMatch(/save the sheet as CSV/);
  });
});

describe('text that is not UTF-8, and other separators (issue 14 point 5)', () => {
  it('names a Windows code page file and the word it holds, never replacement characters', () => {
    const job = demoCopy();
    const text = 'board,ref,polarity,notes\nDB1,1,ok,cuisinière socket\n';
    write(job, 'readings/2026-11-21.csv', Buffer.from(text, 'latin1')); // è is 0xE8 in Windows-1252 and Latin-1
    const [e] = only(job, 'readings/2026-11-21.csv:2:17: this file is not UTF-8 text (byte 0xE8)');
    expect(e).toMatch(/Windows code page.*"cuisinière"/);
    expect(errorsOf(job).join('\n')).not.toContain('\uFFFD');
  });
  it('reads a semicolon-separated file as a comma-separated one', () => {
    const job = demoCopy();
    const comma = readFileSync(join(job, RETEST), 'utf8');
    write(job, RETEST, comma.replace(/,/g, ';'));
    expect(errorsOf(job)).toEqual([]);
    const v = validate(readJob(job), CALC_RULES);
    expect(v.ok && v.project.readings.get('DB1/10')?.zs_ohm?.value).toEqual({ kind: 'value', value: 1.39 });
  });
  it('reads a tab-separated file', () => {
    const job = demoCopy();
    write(job, RETEST, readFileSync(join(job, RETEST), 'utf8').replace(/,/g, '\t'));
    expect(errorsOf(job)).toEqual([]);
  });
  it('names a UTF-16 file', () => {
    const job = demoCopy();
    write(job, RETEST, Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('board,ref\n', 'utf16le')]));
    only(job, `${RETEST}:1:1: this file is saved as UTF-16`);
  });
});

describe('one number grammar for every cell', () => {
  it.each(['1e-3', '6.90e-3', '.690', '6.', '+0.5', '1e-400', '1e309', 'Infinity', '0', '-0', '0.0069', '99999'])('refuses Zs "%s"', (zs) => {
    const job = demoCopy();
    replaceIn(job, RETEST, RETEST_ROW, RETEST_ROW.replace(',1.39,', `,${zs},`));
    only(job, `${RETEST}:2:4: zs_ohm: found "${zs}"`);
  });
  it.each([['r1r2_ohm', '0', 3], ['r1r2_ohm', '-0', 3], ['ir_le_mohm', '1e309', 6], ['ir_test_v', '250 kV', 7], ['ir_test_v', '800', 7]] as const)(
    'refuses %s "%s"', (field, value, column) => {
      const job = demoCopy();
      const cells = RETEST_ROW.split(',');
      cells[column - 1] = value;
      replaceIn(job, RETEST, RETEST_ROW, cells.join(','));
      only(job, `${RETEST}:2:${column}: ${field}: found "${value}"`);
    });
  it('refuses supply.u0_v: 999999999999999999999', () => {
    const job = demoCopy();
    replaceIn(job, 'project.yaml', 'u0_v: 230', 'u0_v: 999999999999999999999');
    only(job, 'project.yaml:15:9: supply.u0_v: found "1000000000000000000000", which is not a plausible u0_v');
  });
  it.each(['1e-3', '0x1', '.inf', '+0.28'])('refuses the YAML number ze_ohm: %s', (v) => {
    const job = demoCopy();
    replaceIn(job, 'project.yaml', 'ze_ohm: 0.28', `ze_ohm: ${v}`);
    only(job, `project.yaml:18:11: found "${v}"; write a number as a plain decimal`);
  });
  it('keeps plain decimals, units and over-range readings', () => {
    const job = demoCopy();
    replaceIn(job, RETEST, RETEST_ROW, RETEST_ROW.replace(',1.39,', ',1390 mΩ,'));
    expect(errorsOf(job)).toEqual([]);
  });
});

describe('ids cannot collide', () => {
  it('refuses a board listed twice', () => {
    const job = demoCopy();
    replaceIn(job, 'project.yaml', '  - { id: DB2, location: Cellar (retained switchfuse)', '  - { id: DB1, location: Cellar (retained switchfuse)');
    only(job, 'project.yaml:32:11: boards.1.id: board "DB1" is listed twice');
  });
  it('never credits readings of board DB1/1, ref 0 to board DB1, ref 1/0', () => {
    const job = demoCopy();
    replaceIn(job, 'project.yaml', '  - { id: DB2,', '  - { id: DB1/1, location: Spare }\n  - { id: DB2,');
    replaceIn(job, 'circuits.csv', 'DB1,1,Lighting shop floor', 'DB1,1/0,Lighting shop floor');
    write(job, 'readings/2026-11-21.csv', 'board,ref,zs_ohm\nDB1/1,0,0.5\n');
    only(job, 'project.yaml:32:11: boards.1.id: found "DB1/1"; a board id cannot hold "/"');
  });
});

describe('YAML aliases', () => {
  it('locates an unknown alias', () => {
    const job = demoCopy();
    replaceIn(job, 'project.yaml', 'title: Tannery Row coffee house refit', 'title: *nope');
    only(job, 'project.yaml:2:8: cannot read this YAML: the alias *nope names no anchor');
  });
  it('locates an alias bomb', () => {
    const job = demoCopy();
    const bomb = ['a: &a [x, x, x, x, x, x, x, x, x]', ...'bcdefgh'.split('').map((k, i) => `${k}: &${k} [${Array(9).fill(`*${'abcdefgh'[i]}`).join(', ')}]`)].join('\n');
    write(job, 'project.yaml', `${readFileSync(join(job, 'project.yaml'), 'utf8')}\nbomb:\n${bomb.replace(/^/gm, '  ')}\n`);
    const errors = errorsOf(job).filter((e) => e.startsWith('project.yaml'));
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatch(/^project\.yaml:\d+:\d+: cannot read this YAML: .*alias/);
  });
});

describe('reads stay inside the job folder', () => {
  const secret = (job: string): string => {
    const path = join(job, '..', '..', '..', `secret-${Math.random().toString(36).slice(2)}.txt`);
    writeFileSync(path, 'board,ref\nTOP-SECRET,1\n');
    return path;
  };
  it('refuses notes.md linking outside the job, and never shows what it links to', () => {
    const job = demoCopy();
    rmSync(join(job, 'notes.md'));
    symlinkSync(secret(job), join(job, 'notes.md'));
    const errors = only(job, 'notes.md:1:1: a link to a file outside the job folder');
    expect(errors.join('\n')).not.toContain('TOP-SECRET');
    expect(readJob(job).notes).toBeNull();
  });
  it('refuses a readings file linking outside the job', () => {
    const job = demoCopy();
    symlinkSync(secret(job), join(job, 'readings/2026-11-21.csv'));
    const errors = only(job, 'readings/2026-11-21.csv:1:1: a link to a file outside the job folder');
    expect(errors.join('\n')).not.toContain('TOP-SECRET');
  });
  it("refuses a firm file (packsmith.yaml) linking outside the firm's folder, for the job and for the archive settings", () => {
    const job = demoCopy();
    const firm = join(job, '..', '..');
    const path = secret(job);
    writeFileSync(path, 'installer:\n  firm: TOP-SECRET Ltd\narchive: TOP-SECRET\n');
    symlinkSync(path, join(firm, 'packsmith.yaml'));
    const errors = only(job, "../../packsmith.yaml:1:1: cannot read the firm file: packsmith.yaml: a link to a file outside the firm file's folder");
    expect(errors.join('\n')).not.toContain('TOP-SECRET');
    const settings = archiveSettings(join(firm, 'projects'));
    expect(settings.errors.map((e) => e.message)).toEqual([expect.stringMatching(/^cannot read the firm file: packsmith\.yaml: a link to a file outside/)]);
    expect(settings.archive).not.toContain('TOP-SECRET');
  });
  it("refuses a firm file linking outside in the build's quick look at an unchanged job, as when the job is read", async () => {
    const job = demoCopy();
    const firm = join(job, '..', '..');
    const text = 'installer:\n  firm: Linked Firm Ltd\n';
    writeFileSync(join(firm, 'packsmith.yaml'), text);
    const quiet = { isTTY: false, write: () => true };
    const once = (log: (l: string) => void = () => {}) => build({ jobs: [job], out: join(firm, 'out'), printer: null, progress: quiet, log });
    expect((await once()).built).toHaveLength(1);
    expect(jobInputFiles(job)?.get('../../packsmith.yaml')?.toString()).toBe(text);
    const path = secret(job);
    writeFileSync(path, text); // the same bytes, so only the link tells it from the file the draft was built from
    rmSync(join(firm, 'packsmith.yaml'));
    symlinkSync(path, join(firm, 'packsmith.yaml'));
    expect(jobInputFiles(job)).toBeNull();
    const lines: string[] = [];
    const r = await once((l) => lines.push(l));
    expect(r.skipped).toEqual([]);
    expect(r.invalid.map((i) => i.job)).toEqual([basename(job)]);
    expect(lines.join('\n')).toMatch(/cannot read the firm file: packsmith\.yaml: a link to a file outside the firm file's folder/);
  });
  it('reads a job through a link to its folder, and a file linking to another inside the job', () => {
    const job = demoCopy();
    mkdirSync(join(job, 'docs'));
    writeFileSync(join(job, 'docs', 'notes.md'), 'Linked notes.\n');
    rmSync(join(job, 'notes.md'));
    symlinkSync(join(job, 'docs', 'notes.md'), join(job, 'notes.md'));
    const linked = join(job, '..', 'linked-job');
    symlinkSync(job, linked);
    expect(errorsOf(linked)).toEqual([]);
    expect(readJob(linked).notes?.text).toBe('Linked notes.\n');
    rmSync(join(job, 'docs', 'notes.md'));
    only(linked, 'notes.md:1:1: a link to nothing (a broken symlink)');
  });
  it('refuses readings/ linking to a folder outside the job, and a pipe among the readings; reads readings/ linking inside', () => {
    const job = demoCopy();
    const elsewhere = join(job, '..', '..', 'elsewhere-readings');
    renameSync(join(job, 'readings'), elsewhere);
    symlinkSync(elsewhere, join(job, 'readings'));
    const errors = only(job, 'readings:1:1: readings: a link to a folder outside the job folder');
    expect(errors.filter((e) => e.startsWith('readings/'))).toEqual([]);
    rmSync(join(job, 'readings'));
    renameSync(elsewhere, join(job, 'data'));
    symlinkSync(join(job, 'data'), join(job, 'readings'));
    expect(errorsOf(job)).toEqual([]);
    expect(readJob(job).sessions.length).toBeGreaterThan(0);
    expect(spawnSync('mkfifo', [join(job, 'data', '2026-11-21.csv')]).status).toBe(0);
    only(job, 'readings/2026-11-21.csv:1:1: not a regular file (a device, pipe or socket)');
  });
  it('refuses a theme outside the firm folder that holds the jobs', () => {
    for (const theme of ['../../../../../../../../etc', '/usr/share']) {
      const job = demoCopy();
      write(job, 'project.yaml', `${readFileSync(join(job, 'project.yaml'), 'utf8')}theme: ${theme}\n`);
      only(job, `project.yaml:47:8: theme: "${theme}" is outside`);
    }
  });
  it('accepts a theme inside the firm folder', () => {
    const job = demoCopy();
    mkdirSync(join(job, '..', '..', 'themes', 'mine'), { recursive: true });
    write(job, 'project.yaml', `${readFileSync(join(job, 'project.yaml'), 'utf8')}theme: ../../themes/mine\n`);
    expect(errorsOf(job)).toEqual([]);
  });
});

describe('plausibility', () => {
  it('queries a measured Zs below the Zdb of its board instead of passing it', () => {
    const job = demoCopy();
    replaceIn(job, RETEST, RETEST_ROW, RETEST_ROW.replace(',1.39,', ',0.30,')); // DB1's Zdb is 0.31 Ω
    const v = validate(readJob(job), CALC_RULES);
    expect(v.ok).toBe(true);
    const c = v.ok ? assess(v.project).circuits.find((x) => x.board === 'DB1' && x.ref === '10') : undefined;
    const zs = c?.checks.find((k) => k.id === 'zs-measured');
    expect(zs?.status).toBe('attention');
    expect(zs?.basis).toMatch(/measured Zs is below (the measured R1\+R2 1\.07 Ω|Zdb 0\.31 Ω at DB1)/); // the first implausibility found is named
  });
  it('gives every measured field and every numeric supply and board field a range', () => {
    const numeric = (shape: object) => Object.keys(shape).filter((k) => /_(v|hz|ohm|mohm|ka|a|ms)$/.test(k));
    const fields = [...Object.keys(MEASURED), ...numeric(SupplySchema.shape), ...numeric(BoardSchema.shape)];
    expect(fields).toEqual(expect.arrayContaining(['zs_ohm', 'u0_v', 'frequency_hz', 'pfc_3ph_ka', 'zdb_ohm']));
    expect(fields.filter((f) => !(f in PLAUSIBLE))).toEqual([]);
  });
  it.each(['0', '99999'])('refuses a three-phase fault current pfc_3ph_ka of %s kA, at the origin and at a board', (v) => {
    // fault current above 0, switchgear rated to about 200 kA (src/reference/plausibility.ts, from memory)
    const job = demoCopy();
    replaceIn(job, 'project.yaml', '  pfc_ka: 2.1\n', `  pfc_ka: 2.1\n  pfc_3ph_ka: ${v}\n`);
    only(job, `project.yaml:20:15: supply.pfc_3ph_ka: found "${v}", which is not a plausible pfc_3ph_ka`);
    const board = demoCopy();
    replaceIn(board, 'project.yaml', 'zdb_ohm: 0.31, pfc_ka: 1.9 }', `zdb_ohm: 0.31, pfc_ka: 1.9, pfc_3ph_ka: ${v} }`);
    only(board, 'project.yaml:31:');
    expect(errorsOf(board)[0]).toMatch(/boards\.0\.pfc_3ph_ka: found ".*", which is not a plausible pfc_3ph_ka/);
  });
  it.each(['0', '-50', '999999'])('refuses a supply frequency_hz of %s', (v) => {
    // public supplies are 50 or 60 Hz (IEC 60038); 15 to 500 Hz holds every low-voltage supply (from memory)
    const job = demoCopy();
    replaceIn(job, 'project.yaml', 'frequency_hz: 50', `frequency_hz: ${v}`);
    only(job, `project.yaml:17:17: supply.frequency_hz: found "${v}", which is not a plausible frequency_hz`);
  });
  it('reads an insulation resistance of 0 MΩ (a dead short) and fails it: zero is a reading, not a slip', () => {
    // IEC 60364-6 Table 6.1: at least 1 MΩ at 500 V d.c.; 0 MΩ is far below it
    const job = demoCopy();
    const cells = RETEST_ROW.split(',');
    cells[5] = '0'; // ir_le_mohm
    replaceIn(job, RETEST, RETEST_ROW, cells.join(','));
    const v = validate(readJob(job), CALC_RULES);
    expect(v.ok, v.ok ? '' : v.errors.map((e) => e.message).join('\n')).toBe(true);
    const c = v.ok ? assess(v.project).circuits.find((x) => x.board === 'DB1' && x.ref === '10') : undefined;
    expect(c?.checks.find((k) => k.id === 'insulation')?.status).toBe('fail');
  });
});
