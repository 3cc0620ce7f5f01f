// How the process runs a one-shot `check` from the shell. V8's optimising compiler works on a
// background thread while the main thread runs; on a job of modest size the run is over before its
// work pays back, and on a two-core machine it competes with the main thread and the collector for
// the cores. So for such a job it is turned off (the results are the same: only how fast the same
// code runs changes); a large job keeps it, as there it pays. Only the command line calls this:
// the test suite's in-process runs keep their workers as they are.
import { statSync } from 'node:fs';
import { join } from 'node:path';
import { setFlagsFromString } from 'node:v8';

/**
 * circuits.csv up to this size (about 600 circuits) is checked without the optimising compiler.
 * Measured with `farm-bench` on generated jobs, wall time without it against with it: 40 circuits
 * 0.85, 300 circuits 0.93, 600 circuits (39 kB) 0.94, 1,000 circuits (65 kB) 1.09.
 */
export const QUICK_CHECK_BYTES = 40_960;

/** The job folder a `check` command line names (its first argument that is not an option), else null. */
export function checkedFolder(argv: readonly string[]): string | null {
  if (argv[0] !== 'check') return null;
  return argv.slice(1).find((a) => !a.startsWith('-')) ?? null;
}

/** Whether a `check` of `argv` is of a job small enough to run without the optimising compiler. */
export function quickCheck(argv: readonly string[]): boolean {
  const dir = checkedFolder(argv);
  if (dir === null) return false;
  try {
    return statSync(join(dir, 'circuits.csv')).size <= QUICK_CHECK_BYTES;
  } catch {
    return false; // no such file: the check itself says so
  }
}

/** Tune this process for the command line `argv` (the arguments after the program name). */
export function tuneFor(argv: readonly string[]): void {
  if (quickCheck(argv)) setFlagsFromString('--no-opt');
}
