// The HTML stage against another revision of packsmith, side by side. The revision is checked out
// into a temporary git worktree and built there (its node_modules are this checkout's); then each
// round runs one cold pass of each code over the same generated jobs, each in a fresh node, the
// two in turn, the first one changing from round to round. This machine's speed swings by half
// from one minute to the next; within a round both codes meet the same minute, so the ratio of
// their times is the figure to read, not either rate.
//
//   node dist/bench/against.js REV [--rounds 6] [--jobs 200] [--projects DIR]
//   npm run bench -- --against REV   (the same, as a row of the bench's table)
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';
import { PACKAGE_ROOT } from '../paths.js';
import { generateArchive } from './generate.js';

const STAGE_AT = fileURLToPath(new URL('./stage-at.js', import.meta.url));

/** A revision checked out and built in a worktree of its own; `remove` takes the worktree away. */
export interface Checkout { rev: string; commit: string; root: string; remove: () => void }

function git(args: string[], cwd = PACKAGE_ROOT): string {
  const r = spawnSync('git', args, { cwd, encoding: 'utf8' });
  if (r.error) throw new Error(`git ${args[0]}: ${r.error.message} (the side-by-side bench needs git and a clone of packsmith)`);
  if (r.status !== 0) throw new Error(`git ${args.join(' ')}: ${r.stderr.trim().split('\n').at(-1) ?? `exit ${r.status}`}`);
  return r.stdout.trim();
}

/** The commit `rev` names (any name git knows: a commit, tag or branch); throws where it names none. */
export const commitOf = (rev: string): string => git(['rev-parse', '--verify', '--end-of-options', `${rev}^{commit}`]);

/** `rev` checked out under the temporary folder and built. */
export function checkoutBuilt(rev: string, say: (s: string) => void = () => {}): Checkout {
  const commit = commitOf(rev);
  const root = join(mkdtempSync(join(tmpdir(), 'packsmith-against-')), 'packsmith');
  git(['worktree', 'add', '--detach', root, commit]);
  const remove = () => {
    spawnSync('git', ['worktree', 'remove', '--force', root], { cwd: PACKAGE_ROOT });
    rmSync(join(root, '..'), { recursive: true, force: true });
    spawnSync('git', ['worktree', 'prune'], { cwd: PACKAGE_ROOT });
  };
  try {
    symlinkSync(join(PACKAGE_ROOT, 'node_modules'), join(root, 'node_modules'), 'dir');
    say(`building ${rev} (${commit.slice(0, 12)}) in ${root}`);
    const built = spawnSync('npm', ['run', 'build', '--silent'], { cwd: root, encoding: 'utf8' });
    if (built.status !== 0) throw new Error(`npm run build failed for ${rev}: ${(built.stderr || built.stdout).trim().split('\n').slice(-3).join(' / ')}`);
  } catch (e) {
    remove();
    throw e;
  }
  return { rev, commit, root, remove };
}

/** Which code runs first in round `round` (0, 1, 2, …) of two: each, in turn. */
export const firstInRound = (round: number): 0 | 1 => (round % 2 === 0 ? 0 : 1);

/** One cold pass by the code at `root` in a fresh node: its seconds and circuits. */
function passAt(root: string, projects: string): { seconds: number; circuits: number } {
  const r = spawnSync(process.execPath, [STAGE_AT, root, projects], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`the HTML stage of the code at ${root} failed: ${r.stderr.trim().split('\n').at(-1) ?? `exit ${r.status}`}`);
  return JSON.parse(r.stdout) as { seconds: number; circuits: number };
}

/** Each round's seconds of this code and of the other (`ours[i]`, `theirs[i]`: round i). */
export interface SideBySide { ours: number[]; theirs: number[]; circuits: number }

/** `rounds` rounds, each a cold pass of this code (at PACKAGE_ROOT) and of the code at `other`, in alternating order. */
export function sideBySide(other: string, projects: string, rounds: number): SideBySide {
  const ours: number[] = [];
  const theirs: number[] = [];
  let circuits = 0;
  for (let i = 0; i < rounds; i++) {
    const order = firstInRound(i) === 0 ? [PACKAGE_ROOT, other] : [other, PACKAGE_ROOT];
    for (const root of order) {
      const pass = passAt(root, projects);
      circuits = pass.circuits;
      (root === other ? theirs : ours).push(pass.seconds);
    }
  }
  return { ours, theirs, circuits };
}

const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 === 1 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};

/** How many times as fast this code is, round by round (their time over ours): median, least and most. */
export function speedUp(r: Pick<SideBySide, 'ours' | 'theirs'>): { median: number; min: number; max: number } {
  if (r.ours.length === 0 || r.ours.length !== r.theirs.length) throw new Error('side by side: each round needs a time of each code');
  const each = r.ours.map((t, i) => r.theirs[i]! / t);
  return { median: median(each), min: Math.min(...each), max: Math.max(...each) };
}

/** The bench's row: this code's speed against `rev`'s, and each one's median rate. */
export function againstRow(rev: string, r: SideBySide): [string, string, string, string] {
  const s = speedUp(r);
  const rate = (xs: number[]) => `${Math.round(r.circuits / median(xs)).toLocaleString('en-GB')} circuits/s`;
  return [
    `HTML stage against ${rev}`,
    `${s.median.toFixed(2)} times as fast`,
    '',
    `each round's ratio ${s.min.toFixed(2)}–${s.max.toFixed(2)}; medians: this code ${rate(r.ours)}, ${rev} ${rate(r.theirs)}; ${r.ours.length} rounds, each a cold pass of each in a fresh node, in turn`,
  ];
}

/** The bench's row for `--against REV`: checked out, built, timed side by side, taken away. */
export function againstRevision(rev: string, projects: string, rounds: number, say: (s: string) => void): [string, string, string, string] {
  const other = checkoutBuilt(rev, say);
  try {
    return againstRow(rev, sideBySide(other.root, projects, rounds));
  } finally {
    other.remove();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const { values, positionals } = parseArgs({ allowPositionals: true, options: { rounds: { type: 'string', default: '6' }, jobs: { type: 'string', default: '200' }, projects: { type: 'string' } } });
  const rev = positionals[0];
  const rounds = Number(values.rounds);
  if (!rev || !Number.isInteger(rounds) || rounds < 1) {
    process.stderr.write('usage: node dist/bench/against.js REV [--rounds N] [--jobs N] [--projects DIR]\n');
    process.exit(2);
  }
  const scratch = mkdtempSync(join(tmpdir(), 'packsmith-against-jobs-'));
  try {
    const projects = values.projects ?? join(scratch, 'projects');
    generateArchive(projects, Number(values.jobs));
    const row = againstRevision(rev, projects, rounds, (s) => process.stderr.write(`against: ${s}\n`));
    process.stdout.write(`${row[0]}: ${row[1]}; ${row[3]}\n`);
  } catch (e) {
    process.stderr.write(`against: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 1;
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}
