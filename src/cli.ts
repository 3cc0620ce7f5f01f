#!/usr/bin/env node
// The command line: src/program.ts declares the commands and options and runs them.
import { runCli } from './program.js';

void runCli(process.argv.slice(2)).then((code) => { process.exitCode = code; });
