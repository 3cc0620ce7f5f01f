// The bench's HTML stage: every job loaded, validated, assessed, rendered through the built-in
// templates and written, on one core. Also runnable alone, for a profile:
//
//   node --cpu-prof dist/bench/html.js [--jobs 200] [--rounds N] [--json] [--projects DIR]
//   (--projects: generate the jobs there, or find them there from an earlier run, unchanged)
//   node dist/bench/html.js --jobs 240 --heap   (heap retained after 30, 60, 120, 240 jobs)
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { pathToFileURL } from 'node:url';
import { loadJob } from '../job.js';
import { engineCache } from '../render/engine.js';
import { renderPackFiles } from '../render/pack.js';
import type { PdfOptions } from '../print/pdf.js';
import { generateArchive } from './generate.js';
import { collectGarbage } from '../print/collect.js';

export interface HtmlStage {
  seconds: number;
  /** CPU time of this process over the stage (user + system): the figure a loaded machine does not skew */
  cpuSeconds: number;
  /** the render alone (view, templates, CSP; not load, assess or write): wall and CPU seconds */
  renderSeconds: number;
  renderCpuSeconds: number;
  /** each pack's HTML file and its running header and footer */
  packs: { html: string; opts: PdfOptions }[];
}

export function htmlStage(jobs: string[], htmlDir: string): HtmlStage {
  const engineFor = engineCache();
  const packs: HtmlStage['packs'] = [];
  mkdirSync(htmlDir, { recursive: true });
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  let renderSeconds = 0;
  let renderCpu = 0;
  for (const dir of jobs) {
    const job = loadJob(dir);
    if (!job.ok) throw new Error(`generated job ${dir} is invalid: ${job.errors[0]?.message}`);
    const r0 = performance.now();
    const rc0 = process.cpuUsage();
    const r = renderPackFiles(job.project, job.assessment, { revisionLabel: 'DRAFT', draft: true, date: '2026-01-23' }, engineFor(null));
    const rc = process.cpuUsage(rc0);
    renderCpu += rc.user + rc.system;
    renderSeconds += (performance.now() - r0) / 1000;
    const file = join(htmlDir, `${job.project.name}.html`);
    writeFileSync(file, r.html);
    packs.push({ html: file, opts: { header: r.header, footer: r.footer, format: 'A4' } });
  }
  const cpu = process.cpuUsage(c0);
  return { seconds: (performance.now() - t0) / 1000, cpuSeconds: (cpu.user + cpu.system) / 1e6, renderSeconds, renderCpuSeconds: renderCpu / 1e6, packs };
}

/**
 * Memory flat in the number of jobs: the heap still held after a full collection, once the HTML
 * stage has run over 30, 60, 120, ... jobs (`node dist/bench/html.js --jobs 240 --heap`).
 * What a stage keeps (bounded caches, the engine) shows as a constant; a leak, as growth.
 */
function retainedHeap(jobs: string[], htmlDir: string): void {
  const gc = () => {
    if (!collectGarbage()) throw new Error('--heap needs V8\'s collector, which this Node does not hand over');
  };
  for (let n = Math.min(30, jobs.length); ; n = Math.min(n * 2, jobs.length)) {
    htmlStage(jobs.slice(0, n), htmlDir);
    gc();
    gc();
    process.stdout.write(`after ${n} jobs: ${(process.memoryUsage().heapUsed / 1048576).toFixed(1)} MB of heap retained\n`);
    if (n === jobs.length) return;
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const { values } = parseArgs({ options: { jobs: { type: 'string', default: '200' }, rounds: { type: 'string', default: '1' }, heap: { type: 'boolean' }, json: { type: 'boolean' }, projects: { type: 'string' } } });
  const root = mkdtempSync(join(tmpdir(), 'packsmith-bench-html-'));
  try {
    const archive = generateArchive(values.projects ?? join(root, 'projects'), Number(values.jobs));
    if (values.heap) retainedHeap(archive.jobs, join(root, 'html'));
    else for (let i = 0; i < Number(values.rounds); i++) {
      const { seconds, cpuSeconds, renderSeconds, renderCpuSeconds } = htmlStage(archive.jobs, join(root, 'html'));
      if (values.json) process.stdout.write(`${JSON.stringify({ jobs: archive.jobs.length, circuits: archive.circuits, seconds, cpuSeconds })}\n`);
      else process.stdout.write(`HTML stage: ${archive.jobs.length} jobs, ${archive.circuits} circuits in ${seconds.toFixed(2)} s wall, ${cpuSeconds.toFixed(2)} s CPU: ${Math.round(archive.circuits / seconds)} circuits/s wall, ${Math.round(archive.circuits / cpuSeconds)} circuits/s CPU; `
        + `render alone ${renderSeconds.toFixed(2)} s wall, ${renderCpuSeconds.toFixed(2)} s CPU: ${Math.round(archive.circuits / renderSeconds)} circuits/s wall, ${Math.round(archive.circuits / renderCpuSeconds)} circuits/s CPU\n`);
    }
  } finally {
    rmSync(root, { recursive: true, force: true });
  }
}
