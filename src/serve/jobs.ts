// The live drafts: every job of the served folder, loaded, validated, assessed and rendered in
// memory; rendered again when its files change. The PDF is printed only when asked for, from the
// draft of that moment, so printing never holds up the preview.
import { today } from '../commands/today.js';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join, resolve } from 'node:path';
import { loadJob } from '../job.js';
import { jobInputFiles } from '../load/job.js';
import { defaultJobs, draftPack, pdfDate } from '../build.js';
import { engineCache } from '../render/engine.js';
import { jobArchiveSettings } from '../archive/location.js';
import { cachedTreeHash, lazyPrinter, packPdf, styleOf, type Printer } from '../produce.js';
import { findChromium } from '../print/browser.js';
import { inspectJob } from '../archive/verify.js';
import { knownHashes, type KnownHashes } from '../archive/known.js';
import { combinedHash, fileHashes } from '../archive/hash.js';
import type { LocatedError } from '../load/raw.js';
import type { Project } from '../model/validate.js';
import type { Assessment, Summary } from '../calc/types.js';
import { pagePatch, parsePage, type ParsedPage, type Replacement } from './patch.js';

export interface Draft {
  project: Project;
  summary: Summary;
  html: string;
  print: () => Promise<Uint8Array>;
}

export interface LiveJob {
  name: string;
  dir: string;
  /** goes up by one each time the draft is rendered from changed files */
  version: number;
  /** SHA-256 of the job's input files as last rendered */
  inputHash: string;
  /** the title as written in project.yaml, when it could be read */
  title: string;
  /** the job's own files, as last read (for showing where an error is) */
  files: Map<string, Buffer>;
  draft: Draft | null;
  errors: LocatedError[];
  /** the folder of the theme the job names, if any */
  theme: string | null;
  /** milliseconds the last render took */
  renderMs: number;
  /** the last few drafts' HTML by version, so an open page can be brought up to date in place */
  shown: Shown[];
}

/** A draft as rendered, and its elements with an id once asked for (null: not plain enough to patch). */
interface Shown {
  version: number;
  html: string;
  parsed?: ParsedPage | null;
}

/** How many past drafts of a job are kept for patching (a page further behind is loaded again). */
const KEEP_SHOWN = 4;

export interface LiveJobsOptions {
  /** a folder of job folders, or one job folder */
  root: string;
  /** where `build` writes drafts and the site (revisions are read from here for the changes section) */
  out: string;
  log?: (line: string) => void;
}

export class LiveJobs {
  readonly root: string;
  private readonly out: string;
  private readonly log: (line: string) => void;
  private readonly jobs = new Map<string, LiveJob>();
  private engineFor = engineCache();
  private treeHash = cachedTreeHash();
  private printer: Printer | null = null;
  private readonly known: KnownHashes;
  private readonly scratch = mkdtempSync(join(tmpdir(), 'packsmith-serve-'));

  constructor(opts: LiveJobsOptions) {
    this.root = resolve(opts.root);
    this.out = resolve(opts.out);
    this.known = knownHashes(this.out);
    this.log = opts.log ?? ((l) => process.stderr.write(`${l}\n`));
  }

  /** True when the served folder is itself a job folder. */
  get single(): boolean {
    return existsSync(join(this.root, 'project.yaml'));
  }

  /** The job folders now in the served folder. */
  folders(): string[] {
    return this.single ? [this.root] : defaultJobs(this.root).map((d) => resolve(d));
  }

  list(): LiveJob[] {
    return [...this.jobs.values()].sort((a, b) => a.name.localeCompare(b.name));
  }

  get(name: string): LiveJob | undefined {
    return this.jobs.get(name);
  }

  /** The job whose folder holds `path`, if any. */
  owner(path: string): LiveJob | undefined {
    const p = resolve(path);
    return [...this.jobs.values()].find((j) => p === j.dir || p.startsWith(`${j.dir}/`));
  }

  /** Find job folders added or removed; returns the names of new jobs. */
  rescan(): string[] {
    const folders = this.folders();
    const names = new Set(folders.map((d) => basename(d)));
    for (const name of this.jobs.keys()) if (!names.has(name)) this.jobs.delete(name);
    const added: string[] = [];
    for (const dir of folders) {
      const name = basename(dir);
      if (this.jobs.has(name)) continue;
      this.jobs.set(name, { name, dir, version: 0, inputHash: '', title: name, files: new Map(), draft: null, errors: [], theme: null, renderMs: 0, shown: [] });
      added.push(name);
    }
    return added;
  }

  /** A theme or the firm file changed: forget every cached template and hash, render everything again. */
  forgetStyles(): void {
    this.engineFor = engineCache();
    this.treeHash = cachedTreeHash();
    for (const j of this.jobs.values()) j.inputHash = '';
  }

  /**
   * Whether a job's files differ from those of its last render (read and hashed, not parsed): a
   * page asked for is then rendered first, so it is current even where the watcher missed a save.
   */
  stale(name: string): boolean {
    const job = this.jobs.get(name);
    const files = job ? jobInputFiles(job.dir) : null;
    return job !== undefined && (files === null || combinedHash(fileHashes(files)) !== job.inputHash);
  }

  /**
   * Load, validate, assess and render one job again. Returns true when its inputs changed since
   * the last render (and the open pages should reload).
   */
  render(name: string): boolean {
    const job = this.jobs.get(name);
    if (!job) return false;
    // a second report of the same save (an editor writing in steps, a watcher telling twice) costs
    // a read and a hash, not a load, check and render that would hold up the page's update
    if (job.version > 0 && job.inputHash !== '' && !this.stale(name)) return false;
    const t0 = performance.now();
    const loaded = loadJob(job.dir, { today: today() });
    const inputHash = combinedHash(fileHashes(loaded.raw.files));
    if (inputHash === job.inputHash && job.version > 0) return false;
    job.inputHash = inputHash;
    job.files = loaded.raw.files;
    const title = (loaded.raw.project?.data as { title?: unknown } | null)?.title;
    job.title = typeof title === 'string' && title.trim() !== '' ? title : name;
    if (!loaded.ok) {
      job.draft = null;
      job.errors = loaded.errors;
    } else {
      try {
        job.draft = this.draftOf(loaded.project, loaded.assessment, job);
        job.errors = [];
      } catch (e) {
        // a theme's template naming a field the view lacks, and the like: shown instead of the pack
        job.draft = null;
        job.errors = [{ file: 'templates', row: 1, column: 1, message: e instanceof Error ? e.message : String(e) }];
      }
    }
    job.version += 1;
    job.renderMs = performance.now() - t0;
    job.shown = job.draft ? [...job.shown, { version: job.version, html: job.draft.html }].slice(-KEEP_SHOWN) : [];
    return true;
  }

  /**
   * What turns a page showing draft `from` of a job into its current draft: the elements to
   * replace, or null when the page must be loaded again (a draft no longer kept, an error page on
   * either side, a change the patch cannot carry).
   */
  patch(name: string, from: number): { version: number; replace: Replacement[] } | null {
    const job = this.jobs.get(name);
    const now = job?.shown.at(-1);
    if (!job || !now || now.version !== job.version) return null;
    if (from === now.version) return { version: now.version, replace: [] };
    const then = job.shown.find((s) => s.version === from);
    if (!then) return null;
    const a = parsedOf(then);
    const b = parsedOf(now);
    const replace = a && b ? pagePatch(a, b) : null;
    return replace ? { version: now.version, replace } : null;
  }

  private draftOf(project: Project, assessment: Assessment, job: LiveJob): Draft {
    const style = styleOf(project, job.dir, {}, this.engineFor, this.treeHash);
    job.theme = project.file.theme ? resolve(job.dir, project.file.theme) : null;
    // the latest issued revision, from the job's archive (never from the drafts' folder); its files'
    // hashes remembered by size and time as a build does, so a save does not re-hash every revision
    const latest = inspectJob(jobArchiveSettings(job.dir).archive, project.name, { known: this.known }).revisions.at(-1) ?? null;
    const { label, data, pack } = draftPack(project, assessment, latest, style, this.log);
    const version = job.version + 1;
    let printed: Promise<Uint8Array> | null = null;
    const print = () => (printed ??= (async () => {
      const printer = this.startPrinter();
      const file = join(this.scratch, `${job.name}-${version}.html`);
      writeFileSync(file, pack.html);
      try {
        return await packPdf(printer, file, project, { ...label, date: pdfDate(label.date) }, pack, style.paper, data);
      } finally {
        rmSync(file, { force: true });
      }
    })());
    return { project, summary: assessment.summary, html: pack.html, print };
  }

  private startPrinter(): Printer {
    if (this.printer) return this.printer;
    const chromium = findChromium();
    if (!chromium) throw new NoChromium();
    this.printer = lazyPrinter(chromium, 1);
    return this.printer;
  }

  async close(): Promise<void> {
    await this.printer?.close();
    rmSync(this.scratch, { recursive: true, force: true });
  }
}

const parsedOf = (s: Shown): ParsedPage | null => (s.parsed === undefined ? (s.parsed = parsePage(s.html)) : s.parsed);

export class NoChromium extends Error {
  constructor() {
    super('no Chromium to print the PDF');
  }
}
