// The bench's large job: one generated job of N circuits (about 40 a board) built with `build`
// from scratch, HTML and PDF, while the resident memory of this process and its Chromium is
// sampled. Run alone so the peak is the build's own:
//
//   node dist/bench/large.js [--circuits 2000] [--keep]
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { pathToFileURL } from 'node:url';
import { build } from '../build.js';
import { findChromium } from '../print/browser.js';
import { lazyPrinter, type Printer } from '../produce.js';
import { generateLargeJob } from './generate.js';
import { sampleTree } from './memory.js';

export interface LargeJobFigures {
  circuits: number;
  boards: number;
  pages: number;
  /** the whole build: load, check, render, print */
  seconds: number;
  /** the print alone: from the pack handed to the printer to its PDF with metadata */
  printSeconds: number;
  /** peak resident memory of node and Chromium together, MB */
  peakMb: number;
  /** at that peak, MB by process: node, Chromium's browser, renderer, and its other processes */
  atPeak: Record<string, number>;
  /** peak proportional set size of node and Chromium together (pages they share counted once), MB */
  peakPssMb: number;
}

/** Build one generated job of `circuits` circuits into a temporary folder; the figures of that build. */
export async function largeJobInProcess(circuits: number, keep = false): Promise<LargeJobFigures> {
  const root = mkdtempSync(join(tmpdir(), 'packsmith-bench-large-'));
  try {
    const { dir, boards } = generateLargeJob(join(root, 'projects'), circuits);
    const chromium = findChromium();
    const printer = chromium ? lazyPrinter(chromium) : null;
    let printSeconds = 0;
    const timed: Printer | null = printer && {
      ...printer,
      print: async (html, opts) => {
        const t = performance.now();
        try {
          return await printer.print(html, opts);
        } finally {
          printSeconds += (performance.now() - t) / 1000;
        }
      },
    };
    const mem = sampleTree(() => process.pid, 100);
    const t0 = performance.now();
    const r = await build({ jobs: [dir], out: join(root, 'out'), printer: timed, progress: { isTTY: false, write: () => true }, log: (l) => process.stderr.write(`${l}\n`) })
      .catch((e: unknown) => e instanceof Error ? e : new Error(String(e)));
    const seconds = (performance.now() - t0) / 1000;
    const peakMb = mem.stop();
    const atPeak = mem.atPeak();
    const peakPssMb = mem.peakPssMb();
    const failed = (why: string) => new Error(`the ${circuits}-circuit job printed no PDF after ${seconds.toFixed(1)} s, peak ${peakMb.toFixed(0)} MB (node + Chromium): ${why}`);
    if (r instanceof Error) throw failed(r.message);
    const pdf = r.built[0]?.pdf;
    if (!pdf) throw failed('no Chromium');
    const { PDFDocument } = await import('pdf-lib');
    const pages = (await PDFDocument.load(readFileSync(pdf), { updateMetadata: false })).getPageCount();
    return { circuits, boards, pages, seconds, printSeconds, peakMb, atPeak, peakPssMb };
  } finally {
    if (keep) process.stderr.write(`kept ${root}\n`);
    else rmSync(root, { recursive: true, force: true });
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const { values } = parseArgs({ options: { circuits: { type: 'string', default: '2000' }, keep: { type: 'boolean' } } });
  const n = Number(values.circuits);
  if (!Number.isInteger(n) || n < 1) throw new Error(`--circuits ${values.circuits}: expected a whole number`);
  largeJobInProcess(n, values.keep ?? false).then(
    (f) => process.stdout.write(`large job: ${f.circuits} circuits on ${f.boards} boards, ${f.pages} pages, ${f.seconds.toFixed(1)} s (print ${f.printSeconds.toFixed(1)} s), peak ${f.peakMb.toFixed(0)} MB RSS, ${f.peakPssMb.toFixed(0)} MB PSS (node + Chromium; at the RSS peak, MB: ${Object.entries(f.atPeak).map(([k, v]) => `${k} ${v}`).join(', ')})\n`),
    (e: unknown) => {
      process.stderr.write(`bench: ${e instanceof Error ? e.message : String(e)}\n`);
      process.exitCode = 1;
    },
  );
}
