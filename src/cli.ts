#!/usr/bin/env node
// The command line: src/program.ts declares the commands and options and runs them.
import { tuneFor } from './commands/tuning.js';
import { runCli } from './program.js';

// A reader that stops early (`packsmith check job | head`) closes the pipe: what is left to print
// is dropped, quietly, and the command's own exit code stands. Any other failure to write is
// thrown as before.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (err: NodeJS.ErrnoException) => {
    if (err.code !== 'EPIPE') throw err;
  });
}

const argv = process.argv.slice(2);
tuneFor(argv);
void runCli(argv).then((code) => { process.exitCode = code; });
