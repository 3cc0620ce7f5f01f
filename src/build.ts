// `build`: every job folder → DIR/<job>/draft/pack.html and pack.pdf, then DIR/index.html.
// One Chromium serves the whole build; without one, the HTML is still written.
import { mkdirSync, writeFileSync, existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { loadJob } from './job.js';
import { formatError, type LocatedError } from './load/raw.js';
import { renderPack } from './render/pack.js';
import { createEngine } from './render/engine.js';
import { overallStatus, STATUS_LOOK } from './render/view.js';
import { findChromium, launchBrowser, type PrintBrowser } from './print/browser.js';
import { printPdf } from './print/pdf.js';
import { renderSite, type SiteEntry } from './archive/site.js';

export interface BuildOptions {
  jobs: string[];
  out: string;
  /** where messages go (stderr by default) */
  log?: (line: string) => void;
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
  const engine = createEngine();
  const result: BuildResult = { built: [], invalid: [], pdfSkipped: false };
  const chromium = findChromium();
  let browser: PrintBrowser | null = null;
  const site: SiteEntry[] = [];
  try {
    if (chromium) browser = await launchBrowser(chromium);
    else result.pdfSkipped = true;
    for (const dir of opts.jobs) {
      const job = loadJob(dir);
      if (!job.ok) {
        result.invalid.push({ job: job.raw.name, errors: job.errors });
        for (const e of job.errors) log(`${job.raw.name}/${formatError(e)}`);
        continue;
      }
      const { project, assessment } = job;
      const target = join(out, project.name, 'draft');
      mkdirSync(target, { recursive: true });
      const html = renderPack(project, assessment, {
        revisionLabel: 'DRAFT',
        draft: true,
        date: lastTestDate(project.sessions, project.file.dates.completed),
      }, engine);
      const htmlPath = join(target, 'pack.html');
      writeFileSync(htmlPath, html);
      let pdfPath: string | null = null;
      if (browser) {
        const { pdf } = await printPdf(browser.browser, htmlPath, { footerLeft: project.file.title, footerMiddle: 'DRAFT' });
        pdfPath = join(target, 'pack.pdf');
        writeFileSync(pdfPath, pdf);
      }
      result.built.push({ job: project.name, html: htmlPath, pdf: pdfPath });
      const links = [{ label: 'draft (HTML)', href: `${project.name}/draft/pack.html` }];
      if (pdfPath) links.push({ label: 'draft (PDF)', href: `${project.name}/draft/pack.pdf` });
      site.push({ job: project.name, title: project.file.title, status: STATUS_LOOK[overallStatus(assessment)].word, links });
    }
  } finally {
    await browser?.close();
  }
  mkdirSync(out, { recursive: true });
  writeFileSync(join(out, 'index.html'), renderSite(site));
  return result;
}
