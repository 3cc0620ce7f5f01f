// The rebuild after one re-test alone, several times over, in archives of N jobs: the figure the
// full bench gives once, repeated so a change can be judged against the machine's noise. The
// archive and its drafts are laid down once in --root (kept and reused when given), then each run
// changes one reading of the middle job and times `build`: its wall time and the CPU time node
// spent (user + system, this process only: Chromium's is not counted). `--blank` prints with the
// blank printer instead of Chromium, so the figures are packsmith's own work alone.
//
//   node dist/bench/rebuild.js [--jobs 200,1000] [--runs 5] [--root DIR] [--blank]
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { parseArgs } from 'node:util';
import { pathToFileURL } from 'node:url';
import { build } from '../build.js';
import { STAMP_FILE } from '../archive/fingerprint.js';
import { buildId } from '../version.js';
import { generateArchive } from './generate.js';
import { blankPrinter, retest } from './scale.js';

const quiet = { isTTY: false, write: () => true };
const seconds = (t0: bigint) => Number(process.hrtime.bigint() - t0) / 1e9;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
/** CPU seconds (user + system) this process spent since `was`. */
const cpuSince = (was: NodeJS.CpuUsage) => {
  const d = process.cpuUsage(was);
  return (d.user + d.system) / 1e6;
};
/** Median, min and max of some seconds. */
const spread = (t: number[]) => `median ${median(t).toFixed(2)} s, min ${Math.min(...t).toFixed(2)}, max ${Math.max(...t).toFixed(2)}`;

/** One timed rebuild: wall and node CPU seconds. */
export interface RebuildTime { wall: number; cpu: number }

/** A draft's stamp rewritten as if this packsmith had built it (bench archives only). */
function adopt(stampPath: string): void {
  if (!existsSync(stampPath)) return;
  const stamp = JSON.parse(readFileSync(stampPath, 'utf8')) as { fingerprint: { packsmith: string } };
  if (stamp.fingerprint.packsmith === buildId()) return;
  stamp.fingerprint.packsmith = buildId();
  writeFileSync(stampPath, `${JSON.stringify(stamp, null, 2)}\n`);
}

/** `runs` rebuilds after one re-test in an archive of `count` jobs under `root` (printed blank with `blank`): each one's seconds. */
export async function rebuilds(root: string, count: number, runs: number, say: (s: string) => void, blank = false): Promise<RebuildTime[]> {
  const projects = join(root, `projects-${count}`);
  const out = join(root, `out-${count}`);
  const laid = existsSync(join(out, 'index.html'));
  const archive = generateArchive(projects, count, 11); // the same jobs each time (seeded)
  if (!laid) {
    const t = process.hrtime.bigint();
    await build({ jobs: archive.jobs, out, printer: await blankPrinter(), progress: quiet, log: () => {} });
    say(`${count} jobs: drafts laid down in ${seconds(t).toFixed(1)} s`);
  } else {
    // drafts laid down by other packsmith code (another build of it, timed against this one) are
    // taken as this code's: only their stamps' build id changes, so the archive need not be laid
    // down again; then a build brings back the job the last run re-tested
    for (const job of archive.jobs) adopt(join(out, basename(job), 'draft', STAMP_FILE));
    await build({ jobs: archive.jobs, out, printer: await blankPrinter(), progress: quiet, log: () => {} });
  }
  const times: RebuildTime[] = [];
  for (let i = 0; i < runs; i++) {
    retest(archive.jobs[Math.floor(count / 2)]!);
    const printer = blank ? await blankPrinter() : undefined;
    const cpu = process.cpuUsage();
    const t = process.hrtime.bigint();
    const r = await build({ jobs: archive.jobs, out, progress: quiet, log: () => {}, ...(printer ? { printer } : {}) });
    times.push({ wall: seconds(t), cpu: cpuSince(cpu) });
    const printed = r.built.filter((b) => b.pdf !== null).length;
    say(`${count} jobs, run ${i + 1}: ${times.at(-1)!.wall.toFixed(2)} s, node CPU ${times.at(-1)!.cpu.toFixed(2)} s, ${printed} printed${blank ? ' (blank)' : ''}, ${r.skipped.length} skipped`);
  }
  return times;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const { values } = parseArgs({ options: { jobs: { type: 'string', default: '200,1000' }, runs: { type: 'string', default: '5' }, root: { type: 'string' }, blank: { type: 'boolean', default: false } } });
  const sizes = values.jobs.split(',').map(Number);
  const runs = Number(values.runs);
  const root = values.root ?? mkdtempSync(join(tmpdir(), 'packsmith-bench-rebuild-'));
  const say = (s: string) => process.stderr.write(`rebuild: ${s}\n`);
  (async () => {
    try {
      for (const n of sizes) {
        const t = await rebuilds(root, n, runs, say, values.blank);
        if (t.length > 0) {
          process.stdout.write(`rebuild after one re-test, ${n} jobs${values.blank ? ', printed blank' : ''}: ${spread(t.map((x) => x.wall))}; node CPU ${spread(t.map((x) => x.cpu))} (${t.length} runs)\n`);
        }
      }
    } finally {
      if (!values.root) rmSync(root, { recursive: true, force: true });
    }
  })().catch((e: unknown) => {
    process.stderr.write(`${e instanceof Error ? e.stack : String(e)}\n`);
    process.exitCode = 1;
  });
}
