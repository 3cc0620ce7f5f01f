// `build`: every job folder → DIR/<job>/draft/pack.html and pack.pdf, then DIR/index.html.
// One Chromium serves the whole build; without one, the HTML is still written.
import { mkdirSync, writeFileSync, existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { loadJob } from './job.js';
import { formatError, type LocatedError } from './load/raw.js';
import { renderPackFiles } from './render/pack.js';
import { engineCache } from './render/engine.js';
import { overallStatus, STATUS_LOOK } from './render/view.js';
import { findChromium, launchBrowser, type PrintBrowser } from './print/browser.js';
import { renderSite, type SiteEntry } from './archive/site.js';
import type { Paper } from './model/schema.js';
import { createPrintPool, type PrintPool } from './print/pool.js';
import { progressLine, type ProgressStream } from './print/progress.js';

export interface BuildOptions {
  jobs: string[];
  out: string;
  /** where messages go (stderr by default) */
  log?: (line: string) => void;
  // ---- theme and paper (a job's own `theme` / `paper` in project.yaml applies where these are not given)
  /** `--theme DIR`: a firm's theme folder for every job of the build */
  theme?: string | null;
  /** `--paper`: A4 or Letter */
  paper?: Paper;
  // ---- printing
  /** pages printing at once (default: one per core) */
  poolSize?: number;
  /** where the progress line goes (default stderr; shown only on a terminal, for more than a few jobs) */
  progress?: ProgressStream;
}

export interface BuildResult {
  built: { job: string; html: string; pdf: string | null }[];
  invalid: { job: string; errors: LocatedError[] }[];
  pdfSkipped: boolean;
}

/** Every folder under projects/ that holds a project.yaml. */
export function defaultJobs(root = 'projects'): string[] {
  if (!existsSync(root)) return [];
  return readdirSync(root)
    .map((n) => join(root, n))
    .filter((p) => statSync(p).isDirectory() && existsSync(join(p, 'project.yaml')))
    .sort();
}

/** The last test date, for a draft's cover (no wall-clock time in outputs). */
function lastTestDate(sessions: { date: string }[], fallback: string | undefined): string {
  return sessions.length ? sessions[sessions.length - 1]!.date : fallback ?? 'no tests recorded';
}

export async function build(opts: BuildOptions): Promise<BuildResult> {
  const log = opts.log ?? ((l: string) => process.stderr.write(`${l}\n`));
  const out = resolve(opts.out);
  const engineFor = engineCache();
  const result: BuildResult = { built: [], invalid: [], pdfSkipped: false };
  const chromium = findChromium();
  let browser: PrintBrowser | null = null;
  let pool: PrintPool | null = null;
  const printing: Promise<void>[] = [];
  const progress = progressLine(opts.jobs.length, opts.progress ?? process.stderr);
  const site: SiteEntry[] = [];
  try {
    if (chromium) {
      browser = await launchBrowser(chromium);
      pool = createPrintPool(browser.browser, opts.poolSize);
    } else result.pdfSkipped = true;
    for (const dir of opts.jobs) {
      const job = loadJob(dir);
      if (!job.ok) {
        result.invalid.push({ job: job.raw.name, errors: job.errors });
        for (const e of job.errors) log(`${job.raw.name}/${formatError(e)}`);
        progress.tick(job.raw.name);
        continue;
      }
      const { project, assessment } = job;
      const target = join(out, project.name, 'draft');
      mkdirSync(target, { recursive: true });
      const theme = opts.theme ?? (project.file.theme ? resolve(job.raw.dir, project.file.theme) : null);
      const paper = opts.paper ?? project.file.paper ?? 'A4';
      const pack = renderPackFiles(project, assessment, {
        revisionLabel: 'DRAFT',
        draft: true,
        date: lastTestDate(project.sessions, project.file.dates.completed),
        paper,
      }, engineFor(theme));
      const htmlPath = join(target, 'pack.html');
      writeFileSync(htmlPath, pack.html);
      const built: BuildResult['built'][number] = { job: project.name, html: htmlPath, pdf: null };
      result.built.push(built);
      const links = [{ label: 'draft (HTML)', href: `${project.name}/draft/pack.html` }];
      if (pool) {
        const pdfPath = join(target, 'pack.pdf');
        links.push({ label: 'draft (PDF)', href: `${project.name}/draft/pack.pdf` });
        printing.push(pool.print(htmlPath, { header: pack.header, footer: pack.footer, format: paper }).then(({ pdf }) => {
          writeFileSync(pdfPath, pdf);
          built.pdf = pdfPath;
          progress.tick(project.name);
        }));
        await pool.room(); // let the pages print while the next packs render, without queueing the whole build
      } else progress.tick(project.name);
      site.push({ job: project.name, title: project.file.title, status: STATUS_LOOK[overallStatus(assessment)].word, links });
    }
    const settled = await Promise.allSettled(printing);
    const failed = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected');
    if (failed) throw failed.reason;
  } finally {
    progress.done();
    await Promise.allSettled(printing);
    await pool?.close();
    await browser?.close();
  }
  mkdirSync(out, { recursive: true });
  writeFileSync(join(out, 'index.html'), renderSite(site));
  return result;
}
