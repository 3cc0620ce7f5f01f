// The bench's figures at scale: a rebuild after one re-test in an archive of N jobs, one large
// job printed by the command line (time, pages, peak memory of packsmith and its Chromium), and
// how soon `check` answers from the shell.
import { spawn, spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { PDFDocument } from 'pdf-lib';
import { build } from '../build.js';
import type { Printer } from '../produce.js';
import { generateArchive, generateLargeJob } from './generate.js';
import { sampleTree } from './memory.js';

const CLI = fileURLToPath(new URL('../cli.js', import.meta.url));
const seconds = (t0: bigint) => Number(process.hrtime.bigint() - t0) / 1e9;
const quiet = { isTTY: false, write: () => true };

/** A printer that prints nothing: a one-page PDF for every pack, to lay down an archive's drafts quickly before the timed rebuild. */
export async function blankPrinter(): Promise<Printer> {
  const doc = await PDFDocument.create();
  doc.addPage();
  const pdf = await doc.save();
  return { print: async () => ({ pdf, refused: [] }), room: async () => {}, close: async () => {} };
}

const HTML_STAGE = fileURLToPath(new URL('./html.js', import.meta.url));

/** The HTML stage's cold pass in a node of its own, started with these flags, on the jobs in `projects`: its seconds, or null where it failed. */
function freshHtmlStage(projects: string, jobs: number, flags: string[]): number | null {
  const r = spawnSync(process.execPath, [...flags, HTML_STAGE, '--jobs', String(jobs), '--json', '--projects', projects], { encoding: 'utf8' });
  if (r.status !== 0) return null;
  try {
    return (JSON.parse(r.stdout) as { seconds: number }).seconds;
  } catch {
    return null;
  }
}

/**
 * The HTML stage of `jobs` generated jobs, each pass in a fresh node: as node starts, and with
 * one V8 helper thread (`--v8-pool-size=1`, docs/building-at-scale.md), alternated `pairs` times.
 * The jobs are generated once, under `root`, and found there by the later passes. Each pass's
 * seconds, null where it failed.
 */
export function htmlStageByPool(root: string, jobs: number, pairs = 3): { asStarted: (number | null)[]; onePool: (number | null)[] } {
  const projects = join(root, `html-stage-${jobs}`);
  const asStarted: (number | null)[] = [];
  const onePool: (number | null)[] = [];
  for (let i = 0; i < pairs; i++) {
    asStarted.push(freshHtmlStage(projects, jobs, []));
    onePool.push(freshHtmlStage(projects, jobs, ['--v8-pool-size=1']));
  }
  return { asStarted, onePool };
}

/** One reading of a generated job changed, as a re-test would: the first circuit's Zs. */
export function retest(jobDir: string): void {
  const file = join(jobDir, 'readings/2026-01-16.csv');
  const lines = readFileSync(file, 'utf8').split('\n');
  const cells = lines[1]!.split(',');
  cells[7] = cells[7] === 'not-tested' ? '0.50' : (Number(cells[7]) + 0.01).toFixed(2); // zs_ohm
  lines[1] = cells.join(',');
  writeFileSync(file, lines.join('\n'));
}

/**
 * N generated jobs, their drafts laid down (HTML rendered, PDFs blank), one reading of one job
 * changed, then `build` timed: the seconds, and how many packs it printed.
 */
export async function rebuildAfterRetest(root: string, count: number): Promise<{ seconds: number; printed: number; setup: number }> {
  const archive = generateArchive(join(root, `projects-${count}`), count, 11);
  const out = join(root, `out-${count}`);
  let t = process.hrtime.bigint();
  await build({ jobs: archive.jobs, out, printer: await blankPrinter(), progress: quiet, log: () => {} });
  const setup = seconds(t);
  retest(archive.jobs[Math.floor(count / 2)]!);
  t = process.hrtime.bigint();
  const r = await build({ jobs: archive.jobs, out, progress: quiet, log: () => {} });
  return { seconds: seconds(t), printed: r.built.filter((b) => b.pdf !== null).length, setup };
}

/** One job of `circuits` circuits built by the command line: wall time, exit code, pages, and peak memory of the whole process tree. */
export async function largeJobFromShell(root: string, circuits: number): Promise<{ seconds: number; code: number | null; pages: number | null; peakMb: number; error: string }> {
  const job = generateLargeJob(join(root, `large-${circuits}`), circuits).dir;
  const out = join(root, `large-out-${circuits}`);
  const t = process.hrtime.bigint();
  const child = spawn(process.execPath, [CLI, 'build', job, '--out', out], { stdio: ['ignore', 'ignore', 'pipe'] });
  const mem = sampleTree(() => child.pid, 100);
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => { stderr += d.toString(); });
  const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
  const s = seconds(t);
  const peakMb = mem.stop();
  let pages: number | null = null;
  try {
    pages = (await PDFDocument.load(readFileSync(join(out, 'bench-job-001/draft/pack.pdf')), { updateMetadata: false })).getPageCount();
  } catch { /* not printed */ }
  return { seconds: s, code, pages, peakMb, error: stderr.trim().split('\n').at(-1) ?? '' };
}

/** `check` of a 40-circuit job from the shell, `runs` times: each wall time in seconds. */
export function checkStart(root: string, runs = 7): number[] {
  const [job] = generateArchive(join(root, 'check-40'), 1, 17, { circuits: [40, 40] }).jobs;
  return Array.from({ length: runs }, () => {
    const t = process.hrtime.bigint();
    spawnSync(process.execPath, [CLI, 'check', job!], { stdio: 'ignore' });
    return seconds(t);
  });
}
