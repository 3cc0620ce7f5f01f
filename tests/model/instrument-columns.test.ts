// Instrument exports read through readings.columns in project.yaml (tests/fixtures/tt-instrument-job).
import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { readJob } from '../../src/load/job.js';
import { readCsv } from '../../src/load/csv.js';
import { readYaml } from '../../src/load/yaml.js';
import { formatError } from '../../src/load/raw.js';
import { validate } from '../../src/model/validate.js';

const FIXTURE = fileURLToPath(new URL('../fixtures/tt-instrument-job/', import.meta.url));
const EXPORT = 'readings/2026-11-27-export.csv';
const HEAD = 'Board,Circuit,Serial,Operator,R1+R2 (Ω),IR L-L (MΩ),IR L-E (MΩ),IR test (V),Polarity,Zs (Ω),RCD 1x (ms),RCD 5x (ms),RCD button,Remarks';

/** The fixture with its export session replaced by this text (and project.yaml edited). */
function withExport(csv: string, editYaml: (y: string) => string = (y) => y) {
  const job = readJob(FIXTURE);
  const session = job.sessions.find((s) => s.table.file === EXPORT)!;
  session.table = readCsv(EXPORT, csv).table;
  const yaml = editYaml(job.files.get('project.yaml')!.toString('utf8'));
  job.project = readYaml('project.yaml', yaml).doc;
  const v = validate(job);
  return { v, lines: v.ok ? [] : v.errors.map(formatError) };
}

const milliohms = (y: string) => y.replace('"R1+R2 (Ω)": r1r2_ohm', '"R1+R2 (mΩ)": r1r2_ohm');

describe('an instrument export under readings.columns', () => {
  const v = validate(readJob(FIXTURE));
  if (!v.ok) throw new Error(v.errors.map(formatError).join('\n'));

  it('reads the export unedited: headers with units, OK for ok, an ignored serial column', () => {
    const barn = v.project.readings.get('CU1/1')!;
    expect(barn.ir_le_mohm).toMatchObject({ value: { kind: 'value', value: 0.6 }, date: '2026-11-27', file: EXPORT });
    expect(barn.polarity!.value).toBe('ok');
    expect(barn.tested_by!.value).toBe('T. Tester');
    expect(barn.notes!.value).toBe('new fitting by the door');
    expect(barn.zs_ohm!.earlier).toEqual([{ value: { kind: 'value', value: 58.9 }, date: '2026-11-13', file: 'readings/2026-11-13.csv' }]);
  });

  it('converts numbers by the unit the header names', () => {
    const { v: w } = withExport(`Board,Circuit,R1+R2 (mΩ),RCD 1x (ms)\nCU1,1,790,27\n`, milliohms);
    if (!w.ok) throw new Error(w.errors.map(formatError).join('\n'));
    expect(w.project.readings.get('CU1/1')!.r1r2_ohm!.value).toEqual({ kind: 'value', value: 0.79 });
  });

  it('lets a cell carry its own unit over the header\'s', () => {
    const { v: w } = withExport(`Board,Circuit,R1+R2 (mΩ)\nCU1,1,0.79 Ω\n`, milliohms);
    expect(w.ok && w.project.readings.get('CU1/1')!.r1r2_ohm!.value).toEqual({ kind: 'value', value: 0.79 });
  });

  it('matches a header written with the ohm sign (U+2126) to a mapping written with omega', () => {
    const { v: w } = withExport(`Board,Circuit,Zs (\u2126)\nCU1,1,59.0\n`);
    expect(w.ok && w.project.readings.get('CU1/1')!.zs_ohm!.value).toEqual({ kind: 'value', value: 59 });
  });

  it('reports an unknown, unmapped column at its header, saying how to map it', () => {
    const { lines } = withExport(`${HEAD},Earth bond (Ω)\nCU1,1,TX-0042,T. Tester,0.79,>999,0.6,500,OK,59.0,27,12,OK,,0.1\n`);
    expect(lines).toContainEqual(expect.stringMatching(/^readings\/2026-11-27-export\.csv:1:15: unknown column "Earth bond \(Ω\)".*readings\.columns in project\.yaml/));
  });

  it('refuses a header unit that does not fit the field it is mapped to', () => {
    const { lines } = withExport(`Board,Circuit,Zs (MΩ),RCD 1x (s)\nCU1,1,59,0.027\n`,
      (y) => y.replace('"Zs (Ω)": zs_ohm', '"Zs (MΩ)": zs_ohm').replace('"RCD 1x (ms)": rcd_1x_ms', '"RCD 1x (s)": rcd_1x_ms'));
    expect(lines).toContainEqual(expect.stringMatching(/^readings\/2026-11-27-export\.csv:1:3: column "Zs \(MΩ\)" is mapped to zs_ohm, but its unit "MΩ" does not fit a resistance in ohms/));
    expect(lines).toContainEqual(expect.stringMatching(/^readings\/2026-11-27-export\.csv:1:4: column "RCD 1x \(s\)" is mapped to rcd_1x_ms, but its unit "s" does not fit a time in milliseconds/));
  });

  it('refuses two columns giving one field', () => {
    const { lines } = withExport(`Board,Circuit,Zs (Ω),zs_ohm\nCU1,1,59,59\n`);
    expect(lines).toContainEqual(expect.stringMatching(/^readings\/2026-11-27-export\.csv:1:4: column "zs_ohm" gives zs_ohm, as column 3 "Zs \(Ω\)" does/));
  });

  it('locates a mapping onto a field packsmith does not have in project.yaml', () => {
    const { lines } = withExport(`Board,Circuit\nCU1,1\n`, (y) => y.replace('Serial: ignore', 'Serial: serial_no'));
    expect(lines).toContainEqual(expect.stringMatching(/^project\.yaml:20:13: readings\.columns\.Serial: found "serial_no"; expected a readings column or "ignore"/));
  });

  it('locates bad cells of an export by the file\'s own row and column', () => {
    const { lines } = withExport(`${HEAD}\nCU1,1,TX-0042,T. Tester,"0,79",>999,0.6,500,OK,-59,0.027,12,maybe,\nCU9,1,TX-0042,,,,,,,,,,,\n`);
    expect(lines).toEqual(expect.arrayContaining([
      expect.stringMatching(/^readings\/2026-11-27-export\.csv:2:5: r1r2_ohm: found "0,79" with a decimal comma/),
      expect.stringMatching(/^readings\/2026-11-27-export\.csv:2:10: zs_ohm: found "-59"; a resistance in ohms cannot be negative/),
      expect.stringMatching(/^readings\/2026-11-27-export\.csv:2:11: rcd_1x_ms: found "0.027", which looks like seconds/),
      expect.stringMatching(/^readings\/2026-11-27-export\.csv:2:13: rcd_button: found "maybe"/),
      expect.stringMatching(/^readings\/2026-11-27-export\.csv:3:1: board "CU9" is not listed under boards/),
    ]));
  });
});
