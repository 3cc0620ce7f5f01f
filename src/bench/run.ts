// `npm run bench`: build a generated archive (200 jobs of 10–40 circuits by default) and print,
// side by side from one run: the HTML stage in circuits/s (and a second pass in the same node,
// its code compiled); the PDF stage per pack against bare
// Chromium printing the same HTML files with the same page.pdf options (the ratio); a full build;
// a rebuild after one re-test in archives of 200 and 1,000 jobs; a 2,000-circuit job's print time,
// pages and peak memory; `check`'s time from the shell; the HTML stage again in fresh nodes, as
// node starts and with one V8 helper thread; the preview refresh; and peak memory.
// `--quick` prints 10 packs in the PDF stage, rebuilds at 200 jobs only, prints a 200-circuit job
// in place of the 2,000-circuit one and leaves out the preview (about two minutes).
// `--against REV` (again for more) adds the HTML stage side by side with another revision of
// packsmith, checked out and built in a temporary worktree: how many times as fast this code is,
// each round a cold pass of each (bench/against.ts).
//
//   npm run bench [-- --jobs N] [--quick] [--keep] [--against REV ...]
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import puppeteer from 'puppeteer-core';
import { pathToFileURL } from 'node:url';
import { build } from '../build.js';
import { findChromium, launchBrowser } from '../print/browser.js';
import { pdfOptions } from '../print/pdf.js';
import { createPrintPool, defaultPoolSize } from '../print/pool.js';
import { generateArchive } from './generate.js';
import { htmlStage } from './html.js';
import { sampleTree } from './memory.js';
import { describeTimes, previewRefresh } from './serve.js';
import { checkStart, htmlStageByPool, largeJobFromShell, rebuildAfterRetest, retest } from './scale.js';
import { againstRevision, commitOf } from './against.js';

const { values } = parseArgs({ options: { jobs: { type: 'string', default: '200' }, keep: { type: 'boolean' }, quick: { type: 'boolean' }, against: { type: 'string', multiple: true } } });
const quick = values.quick === true;
const count = Number(values.jobs);
if (!Number.isInteger(count) || count < 1) throw new Error(`--jobs ${values.jobs}: expected a whole number of jobs`);
for (const rev of values.against ?? []) commitOf(rev); // a name git does not know fails now, not after the bench's other rows

const seconds = (t0: bigint) => Number(process.hrtime.bigint() - t0) / 1e9;
const now = () => process.hrtime.bigint();
const say = (s: string) => process.stderr.write(`bench: ${s}\n`);

async function main() {
  const chromium = findChromium();
  if (!chromium) throw new Error('the bench needs Chromium: run scripts/install-deps.sh or set PACKSMITH_CHROME');
  const root = mkdtempSync(join(tmpdir(), 'packsmith-bench-'));
  const width = defaultPoolSize();

  let t = now();
  const archive = generateArchive(join(root, 'projects'), count);
  const generateS = seconds(t);
  say(`generated ${archive.jobs.length} jobs, ${archive.circuits} circuits in ${generateS.toFixed(2)} s (${root})`);

  // ---- HTML stage: load, validate, assess, render, write (on this core: the figure by CPU time too)
  const html = htmlStage(archive.jobs, join(root, 'html'));
  const { packs, seconds: htmlS } = html;
  say(`HTML stage ${htmlS.toFixed(2)} s, ${html.cpuSeconds.toFixed(2)} s CPU`);
  // the same again in this node, its code now compiled: what the first pass spent on V8's warm-up
  const warmed = htmlStage(archive.jobs, join(root, 'html-again'));
  say(`HTML stage, second pass ${warmed.seconds.toFixed(2)} s, ${warmed.cpuSeconds.toFixed(2)} s CPU`);
  if (quick) packs.splice(10); // the PDF stage and the full build on 10 packs
  const printedJobs = archive.jobs.slice(0, packs.length);

  // ---- PDF stage, bare Chromium: same files, same page.pdf options, same number at once, a page each
  const bare = await puppeteer.launch({ executablePath: chromium, headless: true, args: ['--no-sandbox', `--user-data-dir=${join(root, 'bare-profile')}`] });
  let mem = sampleTree(() => bare.process()?.pid);
  t = now();
  let next = 0;
  await Promise.all(Array.from({ length: width }, async () => {
    while (next < packs.length) {
      const p = packs[next++]!;
      const page = await bare.newPage();
      await page.goto(pathToFileURL(p.html).href, { waitUntil: 'load' });
      await page.pdf(pdfOptions(p.opts));
      await page.close();
    }
  }));
  const bareS = seconds(t);
  const bareMb = mem.stop();
  await bare.close();
  say(`bare Chromium ${bareS.toFixed(2)} s`);

  // ---- PDF stage, packsmith: one Chromium, the page pool, JavaScript off, requests refused
  const ours = await launchBrowser(chromium);
  const pool = createPrintPool(ours, width);
  mem = sampleTree(() => ours.browser.process()?.pid);
  t = now();
  const printing: Promise<unknown>[] = [];
  for (const p of packs) {
    printing.push(pool.print(p.html, p.opts));
    await pool.room();
  }
  await Promise.all(printing);
  const oursS = seconds(t);
  const oursMb = mem.stop();
  await pool.close();
  await ours.close();
  say(`packsmith PDF stage ${oursS.toFixed(2)} s`);

  // ---- the whole build, then a rebuild after one reading of one job changed
  const out = join(root, 'out');
  const quiet = { isTTY: false, write: () => true };
  t = now();
  const full = await build({ jobs: printedJobs, out, progress: quiet, log: say });
  const fullS = seconds(t);
  say(`full build ${fullS.toFixed(2)} s`);
  retest(printedJobs[Math.floor(printedJobs.length / 2)]!);
  t = now();
  const again = await build({ jobs: printedJobs, out, progress: quiet, log: say });
  const rebuildS = seconds(t);
  const printedAgain = again.built.filter((b) => b.pdf !== null).length;
  // ---- at scale: rebuilds in archives of 200 and 1,000 jobs, a large job, check's start
  const rebuilds = [];
  for (const size of quick ? [200] : [200, 1000]) {
    rebuilds.push({ size, ...(await rebuildAfterRetest(root, size)) });
    say(`rebuild at ${size} jobs ${rebuilds.at(-1)!.seconds.toFixed(2)} s`);
  }
  const largeCircuits = quick ? 200 : 2000;
  const large = await largeJobFromShell(root, largeCircuits);
  say(`${largeCircuits}-circuit job ${large.seconds.toFixed(1)} s, exit ${large.code}`);
  const checks = checkStart(root);
  // ---- the HTML stage in a fresh node, as started and with one V8 helper thread, alternated
  const byPool = htmlStageByPool(root, count, 3);
  // ---- the HTML stage side by side with other revisions (--against)
  const against = (values.against ?? []).map((rev) => againstRevision(rev, join(root, 'projects'), quick ? 3 : 5, say));
  // ---- packsmith serve: a save of the biggest job until the open preview shows it
  const preview = quick ? null : await previewRefresh(archive.jobs, chromium);
  if (preview) say(`preview refresh ${describeTimes(preview.saveToPage)}`);
  const nodeMb = process.resourceUsage().maxRSS / 1024;
  const n = packs.length;
  const rows: [string, string, string, string][] = [
    ['HTML stage (load, check, render, write)', `${Math.round(archive.circuits / htmlS)} circuits/s`, '', `${(htmlS / archive.jobs.length * 1000).toFixed(1)} ms per pack; by CPU time ${Math.round(archive.circuits / html.cpuSeconds)} circuits/s`],
    ['HTML stage, a second pass in the same node', `${Math.round(archive.circuits / warmed.seconds)} circuits/s`, '', `${(warmed.seconds / archive.jobs.length * 1000).toFixed(1)} ms per pack; the first pass took ${(htmlS / warmed.seconds).toFixed(2)} times as long, V8 compiling the code as it first runs`],
    ['PDF stage, wall time per pack', `${(oursS / n).toFixed(3)} s`, `${(bareS / n).toFixed(3)} s`, `ratio ${(oursS / bareS).toFixed(2)}`],
    ['PDF stage, all packs', `${oursS.toFixed(1)} s`, `${bareS.toFixed(1)} s`, `${width} pages at once`],
    ['full build (HTML + PDF + index)', `${fullS.toFixed(1)} s`, '', `${full.built.length} packs`],
    ['rebuild after one changed reading', `${rebuildS.toFixed(1)} s`, '', `${printedAgain} of ${n} packs printed again; ratio to full ${(rebuildS / fullS).toFixed(2)}`],
    ...rebuilds.map((r): [string, string, string, string] => [`rebuild after one re-test, ${r.size} jobs`, `${r.seconds.toFixed(2)} s`, '', `${r.printed} pack printed; the drafts laid down first in ${r.setup.toFixed(0)} s (blank PDFs)`]),
    [`${largeCircuits.toLocaleString('en-GB')}-circuit job, build from the shell`, large.code === 0 ? `${large.seconds.toFixed(1)} s` : `failed (exit ${large.code})`, '', `${large.pages ?? 'no'} pages, peak memory ${large.peakMb.toFixed(0)} MB (packsmith + Chromium)${large.code === 0 ? '' : `; ${large.error}`}`],
    poolRow(byPool, archive.circuits),
    ...against,
    ['check of a 40-circuit job, from the shell', `${(median(checks) * 1000).toFixed(0)} ms`, '', `median of ${checks.length}, max ${(Math.max(...checks) * 1000).toFixed(0)} ms`],
    ...(preview ? [[`preview refresh after a save (${preview.circuits} circuits)`, `${describeTimes(preview.saveToPage)}`, '', `save → page shows it, painted, ${preview.saveToPage.length} saves; of which watch ${describeTimes(preview.watch)}, render ${describeTimes(preview.render)}, render end → page ${describeTimes(preview.browser)}; pages loaded again ${preview.reloads}`] as [string, string, string, string]] : []),
    ['peak memory, Chromium (PDF stage)', `${oursMb.toFixed(0)} MB`, `${bareMb.toFixed(0)} MB`, `ratio ${(oursMb / (bareMb || 1)).toFixed(2)}`],
    ['peak memory, node (whole bench)', `${nodeMb.toFixed(0)} MB`, '', ''],
  ];
  const w = [42, 16, 16, 0];
  const line = (r: string[]) => r.map((c, i) => (w[i] ? c.padEnd(w[i]!) : c)).join('  ').trimEnd();
  process.stdout.write([
    `packsmith bench${quick ? ' --quick' : ''}: ${archive.jobs.length} generated jobs (${n} printed), ${archive.circuits} circuits (${(archive.circuits / archive.jobs.length).toFixed(1)} per job), ${availableParallelism()} cores, Chromium ${(await chromiumVersion(chromium))}`,
    line(['', 'packsmith', 'bare Chromium', '']),
    ...rows.map(line),
    '',
  ].join('\n'));
  if (!values.keep) rmSync(root, { recursive: true, force: true });
  else say(`kept ${root}`);
}

const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

/** The HTML stage in fresh nodes, as started and with --v8-pool-size=1: circuits/s of each way's median pass. */
function poolRow(byPool: ReturnType<typeof htmlStageByPool>, circuits: number): [string, string, string, string] {
  const done = (xs: (number | null)[]) => xs.filter((x): x is number => x !== null);
  const a = done(byPool.asStarted);
  const b = done(byPool.onePool);
  const head = 'HTML stage, each pass in a fresh node';
  if (a.length === 0 || b.length === 0) return [head, 'failed', '', `${a.length} and ${b.length} passes finished`];
  const rate = (xs: number[]) => `${Math.round(circuits / median(xs))} circuits/s`;
  return [head, rate(a), '', `with --v8-pool-size=1 ${rate(b)}, ratio of times ${(median(b) / median(a)).toFixed(2)} (docs/building-at-scale.md); medians of ${a.length} passes each way, alternated`];
}

async function chromiumVersion(path: string): Promise<string> {
  const b = await puppeteer.launch({ executablePath: path, headless: true, args: ['--no-sandbox'] });
  try {
    return (await b.version()).replace(/^HeadlessChrome\//, '');
  } finally {
    await b.close();
  }
}

main().catch((e: unknown) => {
  process.stderr.write(`bench: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exitCode = 1;
});
