// The command line's commands and options (commander), as a function from arguments to an exit
// code: src/cli.ts runs it as the program; the test suite runs it in-process too. commander gives
// every command its --help, --version, "did you mean" for a mistyped command or option, and the
// usage errors; each command lives in src/commands/ as a function from its arguments to an exit
// code, imported only when it runs (so `check` starts quickly: build, issue and the printer load
// only for the commands that print).
import { Command, CommanderError } from 'commander';
import { VERSION } from './version.js';

export type Exit = 0 | 1 | 2;
type Run = (args: string[]) => Exit | Promise<Exit>;

const EXIT_CODES = `
Exit codes: 0 all checks passed or do not apply; 1 a check failed or is not verified (or, for issue,
refused; for verify, a finding); 2 the input has errors, each printed as file:row:column: message.
The job folder's format: docs/job-folder.md.`;

function program(argv: string[], done: (code: Exit) => void): Command {
  /** Hand the command's own arguments (everything after its name) to its module. */
  const run = (load: () => Promise<Run>) => async () => done(await (await load())(argv.slice(1)));
  const p = new Command('packsmith')
    .description('Completion packs for electrical circuits: validate job folders, check the arithmetic, render HTML and PDF packs.')
    .version(VERSION, '-v, --version', 'print the version of packsmith')
    .helpOption('-h, --help', 'show help for packsmith or a command')
    .addHelpText('after', EXIT_CODES)
    .showHelpAfterError('(add --help for usage)')
    .configureOutput({ outputError: (text, write) => write(`packsmith: ${text.replace(/^error: /, '')}`) })
    .exitOverride()
    .allowExcessArguments(false);

  p.command('new').description('start a job folder that validates, with the firm\'s settings filled in')
    .argument('<job-folder>', 'the new job folder (must not exist yet)')
    .option('--from <job-folder>', 'an earlier job whose circuits to copy')
    .action(run(async () => (await import('./commands/new.js')).newCommand));

  p.command('check').description('validate and assess one job; exit 0 all passed, 1 open items, 2 invalid input')
    .argument('<job-folder>', 'the job folder (project.yaml, circuits.csv, readings/, notes.md)')
    .option('--json', 'print the assessment as JSON')
    .option('--explain', 'the working of every check, not only the open ones')
    // zod's compiled parsers off before check's modules build their schemas (commands/jitless.ts)
    .action(run(async () => (await import('./commands/jitless.js'), await import('./commands/check.js')).checkCommand));

  p.command('build').description('render draft packs (HTML and PDF) into DIR/<job>/draft/ and the site DIR/index.html; unchanged jobs are skipped')
    .argument('[job-folder...]', 'job folders (default: every folder under projects/)')
    .option('--out <DIR>', 'where drafts and the site go', 'out')
    .option('--force', 'build every job again, changed or not')
    .option('--theme <DIR>', 'a firm\'s folder of templates, partials, stylesheet and logo, for every job')
    .option('--paper <size>', 'A4 or Letter')
    .option('--archive <DIR>', 'where the jobs\' issued revisions are (default archive/ beside the job folders\' folder, or packsmith.yaml\'s archive:)')
    .option('--shard <K/N>', 'build only shard K of N (the jobs split by a hash of their folder name) and no site, for N runners in parallel')
    .option('--site', 'join the shards\' output folders given as arguments into --out and write the site there (no job is built)')
    .action(run(async () => (await import('./commands/build.js')).buildCommand));

  p.command('device').description('a protective device\'s characteristic: operating time at a current, Ia and max Zs')
    .argument('<code>', 'a device code, e.g. mcb:B, rcbo:C, fuse:gG, fuse:bs3036')
    .argument('<rating>', 'its rated current, e.g. 32')
    .option('--at <AMPS>', 'the operating time at this current')
    .option('--within <SECONDS>', 'Ia and max Zs for this disconnection time (repeatable; default 0.4 and 5)')
    .option('--u0 <V>', 'nominal voltage to earth (default 230)')
    .option('--cmin <C>', 'voltage factor Cmin (default the rule set\'s)')
    .option('--json', 'print JSON')
    .action(run(async () => (await import('./commands/device.js')).deviceCommand));

  p.command('issue').description('freeze the next revision into the job\'s archive (archive/<job>/rev-N/); exit 0 issued, 1 refused, 2 invalid input')
    .argument('<job-folder>', 'the job folder')
    .requiredOption('--by <NAME>', 'the person issuing the pack')
    .option('--date <YYYY-MM-DD>', 'the issue date (default today)')
    .option('--reason <TEXT>', 'why this revision is issued')
    .option('--accept-open-items', 'issue although checks failed or are not verified (the pack lists them first)')
    .option('--out <DIR>', 'the drafts\' folder, which the archive must not be inside', 'out')
    .option('--archive <DIR>', 'the archive folder (default archive/ beside the job folders\' folder, or packsmith.yaml\'s archive:)')
    .option('--key <FILE>', 'sign the manifest with this private key (or PACKSMITH_KEY)')
    .action(run(async () => (await import('./commands/issue.js')).issueCommand));

  p.command('verify').description('check the record both ways: revisions.yaml against the archive, every file against its manifest, every signature; exit 1 on any finding')
    .argument('[DIR]', 'the folder of job folders (default projects/), one job folder, or an archive folder')
    .option('--key <FILE.pub>', 'the firm\'s public key (default packsmith.yaml\'s public_key)')
    .option('--archive <DIR>', 'the archive folder')
    .action(run(async () => (await import('./commands/verify.js')).verifyCommand));

  const key = p.command('key').description('the firm\'s signing key');
  key.command('create').description('write a new Ed25519 private key to FILE (mode 600) and its public key to FILE.pub')
    .argument('<FILE>', 'the private key file (kept outside the archive)')
    .action(run(async () => (await import('./commands/key.js')).keyCommand));

  const archive = p.command('archive').description('the archive of issued revisions');
  archive.command('move-from').description('move revisions an earlier packsmith issued into <out-dir>/<job>/rev-N/ into the archive')
    .argument('<out-dir>', 'the old output folder')
    .argument('[jobs-folder]', 'the folder of job folders (default projects/)')
    .option('--archive <DIR>', 'the archive folder')
    .action(run(async () => (await import('./commands/archive.js')).archiveCommand));

  p.command('serve').description('live drafts of every job, re-rendered on save, and a page per job to record a test session')
    .argument('[folder]', 'the folder of job folders (default projects/) or one job folder')
    .option('--port <N>', 'the port (default 4417; 0 picks a free one)')
    .option('--host <H>', 'the address to listen on (default 127.0.0.1; another needs the printed token)')
    .option('--out <DIR>', 'where build left the site', 'out')
    .action(run(async () => (await import('./commands/serve.js')).serveCommand));

  for (const c of [...p.commands, ...key.commands, ...archive.commands]) c.exitOverride().showHelpAfterError(`(add --help for usage of packsmith ${c.name()})`).allowExcessArguments(false);
  return p;
}

/** Run the command line on `argv` (the arguments after the program name): its exit code. */
export async function main(argv: string[]): Promise<Exit> {
  let code: Exit = 0;
  const p = program(argv, (c) => { code = c; });
  if (argv.length === 0) {
    p.outputHelp({ error: true });
    return 2;
  }
  try {
    await p.parseAsync(argv, { from: 'user' });
  } catch (err) {
    if (!(err instanceof CommanderError)) throw err;
    // --help and --version end here too, with exit code 0; a usage error was printed already
    return err.exitCode === 0 ? 0 : 2;
  }
  return code;
}

/** `main`, with an error that reaches it (ours, since input problems are reported by the stages) said plainly: exit 2. */
export async function runCli(argv: string[]): Promise<Exit> {
  try {
    return await main(argv);
  } catch (err) {
    process.stderr.write(`packsmith: ${err instanceof Error ? err.message : String(err)}\n`);
    return 2;
  }
}
