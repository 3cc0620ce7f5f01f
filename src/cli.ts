#!/usr/bin/env node
// The command line: src/program.ts declares the commands and options and runs them.
import { tuneFor } from './commands/tuning.js';
import { runCli } from './program.js';

const argv = process.argv.slice(2);
tuneFor(argv);
void runCli(argv).then((code) => { process.exitCode = code; });
