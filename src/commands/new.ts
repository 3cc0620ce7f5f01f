// `packsmith new <job-folder> [--from <job-folder>]`: a new job folder that validates as written.
// project.yaml holds what packsmith needs, each value to be replaced marked FILL IN, the optional
// fields as commented prompts, and the line that lets an editor check it against the JSON
// Schema. The firm file's values are inherited (not copied: a change to the firm file reaches
// every job), and shown as comments. With --from, the earlier job's boards and circuits come along.
import { parseArgs } from 'node:util';
import { copyFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { basename, join, relative, resolve } from 'node:path';
import { stringify } from 'yaml';
import { readFirm } from '../load/firm.js';
import { readYaml } from '../load/yaml.js';
import { CIRCUIT_REQUIRED, EARTHING } from '../model/schema.js';
import { missingFolder } from './folders.js';
import { FILL_IN } from './placeholders.js';
import { packagePath } from '../paths.js';

/** The JSON Schema of project.yaml shipped with packsmith (schema/ beside dist/ and src/). */
export const PROJECT_SCHEMA = packagePath('schema/project.schema.json');

const FILL = FILL_IN;

const indent = (text: string, prefix: string): string =>
  text.trimEnd().split('\n').map((l) => `${prefix}${l}`).join('\n');

/** The earlier job's project.yaml fields that carry over: its boards, spreadsheet mapping and number of phases (its circuits need them). */
interface Earlier { boards: unknown; circuits: unknown; phases: unknown }

function earlier(from: string): Earlier | null {
  const path = join(from, 'project.yaml');
  if (!existsSync(path)) return null;
  const { doc } = readYaml('project.yaml', readFileSync(path, 'utf8'));
  const data = (doc?.data ?? {}) as { boards?: unknown; circuits?: unknown; supply?: { phases?: unknown } };
  return { boards: data.boards, circuits: data.circuits, phases: data.supply?.phases };
}

export function projectYaml(jobDir: string, from: Earlier | null): string {
  const firm = readFirm(jobDir);
  const firmData = (firm?.doc?.data ?? {}) as Record<string, unknown>;
  const schema = relative(resolve(jobDir), PROJECT_SCHEMA).split('\\').join('/');
  const lines = [
    `# yaml-language-server: $schema=${schema}`,
    `# A new job. Replace every "${FILL} ..." value; lines starting with # are optional fields.`,
    '# Every file, field, unit and allowed value: docs/job-folder.md in packsmith.',
    `title: ${FILL} the job title, e.g. Ground-floor refit`,
    'client:',
    `  name: ${FILL} the client's name`,
    '  # address: the client\'s address',
    'site:',
    `  address: ${FILL} the site address`,
  ];
  const inherited = Object.keys(firmData).filter((k) => !['archive', 'public_key'].includes(k));
  if (firm && 'installer' in firmData) {
    lines.push(`# From the firm file ${firm.file} (a field given here overrides it):`);
    lines.push(indent(stringify(Object.fromEntries(inherited.map((k) => [k, firmData[k]]))), '#   '));
  } else {
    lines.push(
      'installer:',
      `  firm: ${FILL} your firm's name (or put it in a packsmith.yaml beside your job folders)`,
      '  # address: the firm\'s address',
      '  # contact: a phone number or email',
    );
  }
  lines.push(
    '# dates:',
    '#   started: YYYY-MM-DD',
    '#   completed: YYYY-MM-DD',
    'supply:',
    `  earthing: TN-C-S     # ${FILL}: the earthing system (${EARTHING.filter((e) => e !== 'IT').join(', ')}; IT is not assessed), then delete this comment`,
    '  u0_v: 230            # nominal voltage to earth, V',
    `  phases: ${from?.phases === 3 || from?.phases === '3' ? 3 : 1}            # 1 or 3`,
    '  frequency_hz: 50',
    '  # ze_ohm: 0.28       # external earth fault loop impedance, measured (without it the design Zs is not verified)',
    '  # pfc_ka: 2.1        # prospective fault current at the origin, measured',
    '  # ra_ohm: 45         # TT only: the installation earth electrode resistance',
    '  # main_switch: 100 A 2-pole',
  );
  if (from && Array.isArray(from.boards) && from.boards.length > 0) {
    lines.push('# the boards of the earlier job (its circuits were copied into circuits.csv)');
    lines.push(stringify({ boards: from.boards }).trimEnd());
  } else {
    lines.push(
      'boards:               # every distribution board; circuits.csv names them in its board column',
      `  - { id: DB1, location: ${FILL} where the board is }   # also zdb_ohm, pfc_ka when measured`,
    );
  }
  if (from && from.circuits !== undefined) lines.push(stringify({ circuits: from.circuits }).trimEnd());
  lines.push(
    '# rules:               # overrides of the rule set\'s values (each one is listed in the pack)',
    '#   cmin: 0.95',
    '#   measured_zs_factor: 0.8',
    '# readings:            # an instrument export\'s column headers → packsmith\'s readings columns',
    '#   columns:',
    '#     "Zs (Ω)": zs_ohm',
    '#     Serial: ignore',
  );
  return `${lines.join('\n')}\n`;
}

const NOTES = `# Notes

<!-- Optional Markdown, printed in the pack. Replace these prompts or delete them. -->

## Scope and extent

## Departures

## Observations
`;

export function newCommand(args: string[]): 0 | 2 {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: { from: { type: 'string' } } });
  const dir = positionals[0]!;
  if (existsSync(dir)) {
    process.stderr.write(`packsmith: "${dir}" already exists; new writes a new job folder and never touches an existing one\n`);
    return 2;
  }
  if (values.from !== undefined) {
    const missing = missingFolder(values.from, 'job folder');
    if (missing) {
      process.stderr.write(`--from: ${missing}\n`);
      return 2;
    }
    if (!existsSync(join(values.from, 'circuits.csv'))) {
      process.stderr.write(`packsmith: --from "${values.from}" has no circuits.csv to copy\n`);
      return 2;
    }
  }
  const from = values.from === undefined ? null : earlier(values.from);
  mkdirSync(join(dir, 'readings'), { recursive: true });
  writeFileSync(join(dir, 'project.yaml'), projectYaml(dir, from));
  if (values.from !== undefined) copyFileSync(join(values.from, 'circuits.csv'), join(dir, 'circuits.csv'));
  else writeFileSync(join(dir, 'circuits.csv'), `${CIRCUIT_REQUIRED.join(',')}\n`);
  writeFileSync(join(dir, 'notes.md'), NOTES);
  const files = ['project.yaml', 'circuits.csv', 'readings/', 'notes.md'];
  process.stdout.write(`new job ${basename(resolve(dir))}:\n${files.map((f) => `  ${join(dir, f)}`).join('\n')}\n`);
  process.stdout.write(`next: fill in project.yaml (each "${FILL}"), one row per circuit in circuits.csv, then packsmith check ${dir} (it lists what is still to fill in)\n`);
  return 0;
}
