#!/usr/bin/env node
// The command line: parse arguments, call the stages, print, set exit codes (CONTRACT.md).
import { boardJson } from './calc/tree/json.js';
import { parseArgs } from 'node:util';
import { loadJob } from './job.js';
import { formatError } from './load/raw.js';
import { assessmentText } from './render/text.js';
import { PAPER } from './model/schema.js';
// build, issue and the printer (puppeteer-core, pdf-lib) load only for the commands that print,
// so `check`, `device` and `verify` start quickly on site.
import { existsSync, statSync } from 'node:fs';
import { today } from './commands/today.js';

const USAGE = `usage:
  packsmith build [job-folder...] [--out DIR] [--force] [--theme DIR] [--paper A4|Letter] [--archive DIR]
                                                render draft packs (HTML and PDF) into DIR (default out/); unchanged jobs are
                                                skipped unless --force; --theme: a firm's folder of templates, partials, stylesheet, logo
  packsmith check <job-folder> [--json] [--explain]
                                                validate and assess one job: a line per circuit and every open item in full
                                                (--explain: the working of every check); exit 0 all passed, 1 open items, 2 invalid input
  packsmith device <code> <rating> [--at AMPS] [--within SECONDS] [--u0 V] [--cmin C] [--json]   look up a device's characteristic
  packsmith issue <job-folder> --by NAME [--date YYYY-MM-DD] [--reason TEXT] [--accept-open-items] [--out DIR] [--archive DIR] [--key FILE]
                                                freeze the next revision into the job's archive (archive/<job>/rev-N/ beside the job
                                                folders' folder, or packsmith.yaml's archive:), signed with --key (or PACKSMITH_KEY);
                                                exit 0 issued, 1 refused, 2 invalid input
  packsmith verify [DIR] [--key FILE.pub] [--archive DIR]
                                                check the record both ways: each job's revisions.yaml against the archive, every file
                                                against its manifest, every signature (DIR: job folders' folder, default projects/, a job
                                                folder, or an archive folder); exit 1 on any finding
  packsmith key create FILE                     a new Ed25519 key pair: FILE (private, mode 600) and FILE.pub
  packsmith archive move-from <out-dir> [jobs-folder] [--archive DIR]
                                                move revisions an earlier packsmith issued into <out-dir>/<job>/rev-N/ into the archive
  packsmith serve [folder] [--port N] [--host H] [--out DIR]
                                                live drafts of every job in folder (default projects/), re-rendered on save, and a page
                                                per job to record a test session; 127.0.0.1:4417 by default (another host needs the printed token)
`;

type Exit = 0 | 1 | 2;

function check(args: string[]): Exit {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: { json: { type: 'boolean' }, explain: { type: 'boolean' } } });
  if (positionals.length !== 1) {
    process.stderr.write(`packsmith check needs one job folder\n${USAGE}`);
    return 2;
  }
  const job = loadJob(positionals[0]!, { today: today() });
  if (!job.ok) {
    for (const e of job.errors) process.stderr.write(`${formatError(e)}\n`);
    process.stderr.write(`${job.errors.length} problem${job.errors.length === 1 ? '' : 's'} in ${job.raw.name}; nothing was assessed\n`);
    if (values.json) process.stdout.write(`${JSON.stringify({ job: job.raw.name, errors: job.errors }, null, 2)}\n`);
    return 2;
  }
  const a = job.assessment;
  if (values.json) {
    const { overrides, ...rules } = a.rules;
    process.stdout.write(`${JSON.stringify({ job: a.job, rules: { ...rules, overrides }, ...(a.boards ? { boards: a.boards.map(boardJson) } : {}), circuits: a.circuits, summary: a.summary, departures: a.departures }, null, 2)}\n`);
  } else {
    process.stdout.write(assessmentText(a, { explain: values.explain ?? false, width: Math.max(60, Math.min(process.stdout.columns ?? 100, 120)) }));
  }
  return a.summary.fail > 0 || a.summary['not-verified'] > 0 ? 1 : 0;
}

async function buildCommand(args: string[]): Promise<Exit> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      out: { type: 'string', default: 'out' }, force: { type: 'boolean', default: false },
      theme: { type: 'string' }, paper: { type: 'string' }, archive: { type: 'string' },
    },
  });
  const { build, defaultJobs } = await import('./build.js');
  const { NO_CHROMIUM_HELP } = await import('./print/browser.js');
  const jobs = positionals.length ? positionals : defaultJobs();
  if (jobs.length === 0) {
    process.stderr.write('no job folders given and none found under projects/\n');
    return 2;
  }
  const paper = values.paper === undefined ? undefined : PAPER.find((p) => p.toLowerCase() === values.paper!.toLowerCase());
  if (values.paper !== undefined && paper === undefined) {
    process.stderr.write(`packsmith: --paper "${values.paper}": expected ${PAPER.join(' or ')}\n`);
    return 2;
  }
  if (values.theme !== undefined && !(existsSync(values.theme) && statSync(values.theme).isDirectory())) {
    process.stderr.write(`packsmith: --theme "${values.theme}": no such folder; expected a folder of templates, partials, pack.css, theme.css or a logo\n`);
    return 2;
  }
  const r = await build({ jobs, out: values.out!, force: values.force!, theme: values.theme ?? null, archive: values.archive ?? null, today: today(), ...(paper ? { paper } : {}) });
  for (const b of r.built) process.stdout.write(`${b.job}: ${b.html}${b.pdf ? `\n${b.job}: ${b.pdf}` : ''}\n`);
  for (const s of r.skipped) process.stdout.write(`${s.job}: unchanged, kept ${s.dir}\n`);
  if (r.pdfSkipped) process.stderr.write(`${NO_CHROMIUM_HELP}\n`);
  return r.invalid.length > 0 ? 2 : 0;
}

async function main(argv: string[]): Promise<Exit> {
  const [command, ...rest] = argv;
  switch (command) {
    case 'check': return check(rest);
    case 'build': return buildCommand(rest);
    case 'device': return (await import('./commands/device.js')).deviceCommand(rest);
    case 'issue': return (await import('./commands/issue.js')).issueCommand(rest);
    case 'verify': return (await import('./commands/verify.js')).verifyCommand(rest);
    case 'key': return (await import('./commands/key.js')).keyCommand(rest);
    case 'archive': return (await import('./commands/archive.js')).archiveCommand(rest);
    case 'serve': return (await import('./commands/serve.js')).serveCommand(rest);
    case undefined: case '-h': case '--help': case 'help':
      process.stdout.write(USAGE);
      return command === undefined ? 2 : 0;
    default:
      process.stderr.write(`unknown command "${command}"\n${USAGE}`);
      return 2;
  }
}

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code; },
  (err: unknown) => {
    // Input problems are reported by the stages; anything reaching here is ours, said plainly.
    process.stderr.write(`packsmith: ${err instanceof Error ? err.message : String(err)}\n`);
    process.exitCode = 2;
  },
);
