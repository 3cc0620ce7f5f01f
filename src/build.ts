// `build`: every job folder → DIR/<job>/draft/pack.html and pack.pdf, then the archive site.
// Incremental: a job whose draft was built from the same inputs, templates, packsmith version and
// latest revision is skipped (--force builds it anyway). One Chromium serves the whole build,
// started only when something needs printing; without one, the HTML is still written.
import { existsSync, mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { loadJob } from './job.js';
import { formatError, type LocatedError } from './load/raw.js';
import { engineCache } from './render/engine.js';
import { findChromium } from './print/browser.js';
import { progressLine, type ProgressStream } from './print/progress.js';
import type { Paper } from './model/schema.js';
import { packData, dataBytes } from './archive/data.js';
import { combinedHash, fileHashes, sha256 } from './archive/hash.js';
import { inspectJob, type IssuedRevision, type JobArchive } from './archive/verify.js';
import { knownHashes } from './archive/known.js';
import { firmBytesOf, jobInputFiles, type FirmBytes } from './load/job.js';
import { changesSince } from './archive/previous.js';
import { outputStats, stampBytes, stampMemo, upToDate, STAMP_FILE, type Fingerprint, type Stamp } from './archive/fingerprint.js';
import { writeReplacing } from './archive/files.js';
import { mayHaveChanged } from './archive/touched.js';
import { writeSite, type SiteSource } from './archive/site.js';
import { jobArchiveSettings, type ArchiveSettings } from './archive/location.js';
import { jobFolders } from './load/jobs.js';
import { cachedTreeHash, lazyPrinter, ownTheme, packFiles, packPdf, styleOf, templatesHash, type PackStyle, type Printer } from './produce.js';
import type { Project } from './model/validate.js';
import type { Assessment } from './calc/types.js';
import { claimOut, outDir } from './archive/out.js';
import { buildId, VERSION } from './version.js';

export interface BuildOptions {
  jobs: string[];
  out: string;
  /** `--archive DIR`: where issued revisions live (else the firm file's `archive`, else archive/ beside the job folders' folder) */
  archive?: string | null;
  /** today's date (read by the command line): a test session dated later is an input error */
  today?: string;
  /** rebuild every job, changed or not */
  force?: boolean;
  /** write the archive site (default true; a shard of a build leaves it to `build --site`) */
  site?: boolean;
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
  /** the printer (default: one Chromium, started when a pack needs printing; the bench gives its own) */
  printer?: Printer | null;
  /** where the progress line goes (default stderr; shown only on a terminal, for more than a few jobs) */
  progress?: ProgressStream;
}

export interface BuildResult {
  built: { job: string; html: string; pdf: string | null }[];
  /** jobs whose draft was already up to date */
  skipped: { job: string; dir: string }[];
  invalid: { job: string; errors: LocatedError[] }[];
  pdfSkipped: boolean;
}

/** Every folder under projects/ that holds a project.yaml. */
export const defaultJobs = (root = 'projects'): string[] => jobFolders(root);

/** The last test date, for a draft's cover (no wall-clock time in outputs). */
function lastTestDate(sessions: { date: string }[], fallback: string | undefined): string {
  return sessions.length ? sessions[sessions.length - 1]!.date : fallback ?? 'no tests recorded';
}

/** The PDF's dates: the draft's date, or a fixed one when the job has no date at all (never the clock). */
export const pdfDate = (d: string): string => (/^\d{4}-\d{2}-\d{2}$/.test(d) ? d : '1970-01-01');

/** A job's draft: labelled with its last test date, with the changes since its latest revision (`latest`). */
export function draftPack(project: Project, assessment: Assessment, latest: IssuedRevision | null, style: PackStyle, log: (line: string) => void) {
  const date = lastTestDate(project.sessions, project.file.dates.completed);
  const label = { label: 'DRAFT', draft: true, date };
  const data = dataBytes(packData(project, assessment, VERSION, null));
  const since = changesSince(latest, data, null);
  if (!since.ok) log(`${project.name}: no changes section in the draft: ${since.why} (run packsmith verify)`);
  return { date, label, data, pack: packFiles(project, assessment, label, since.ok ? since.changes : null, style) };
}

/**
 * `make` for a job folder, worked once per holder folder (the folder the job folders are in) and
 * kept, a throw included: what is read from the holder upwards, the firm file and the archive
 * settings, is the same for every job folder in it.
 */
function perHolder<T>(make: (dir: string) => T): (dir: string) => T {
  const kept = new Map<string, { value: T } | { error: unknown }>();
  return (dir) => {
    const holder = resolve(dir, '..');
    let k = kept.get(holder);
    if (!k) {
      try {
        k = { value: make(dir) };
      } catch (error) {
        k = { error };
      }
      kept.set(holder, k);
    }
    if ('error' in k) throw k.error;
    return k.value;
  };
}

/** Memoised per build: the archive settings and firm file of a job folder's holder, what the archive holds for a job, and each draft's stamp. */
function lookups(override: string | null, out: string) {
  const archives = new Map<string, JobArchive>();
  const known = knownHashes(out);
  return {
    known,
    stamps: stampMemo(),
    /** the firm file of a job folder's holder, read once */
    firmOf: perHolder(firmBytesOf),
    settingsOf: perHolder((dir): ArchiveSettings => jobArchiveSettings(dir, override)),
    inspect: (archive: string, job: string): JobArchive => {
      const key = `${archive}\0${job}`;
      let a = archives.get(key);
      if (!a) archives.set(key, (a = inspectJob(archive, job, { known })));
      return a;
    },
  };
}

/**
 * The quick look at a job: when its input files (by content hash), its own theme and paper, its
 * archive and latest revision are those its draft's stamp records, and the draft's files are as
 * written, the draft is up to date and the job is not read, checked or rendered again.
 */
function unchanged(dir: string, target: string, stamp: Stamp | null, archive: string, latest: number | null, given: Pick<BuildOptions, 'theme' | 'paper'>, printing: boolean, treeHash: (dir: string) => string, firmOf: FirmBytes): Stamp | null {
  const source = stamp?.source;
  if (!stamp || !source || source.dir !== resolve(dir) || stamp.archive !== archive) return null;
  const files = jobInputFiles(dir, firmOf);
  if (!files) return null;
  const want: Fingerprint = {
    packsmith: buildId(),
    input_hash: combinedHash(fileHashes(files)),
    templates_hash: templatesHash(given.theme ?? source.theme, given.paper ?? source.paper ?? 'A4', treeHash),
    base_revision: latest,
    pdf: printing,
  };
  return upToDate(target, stamp, want) ? stamp : null;
}

/**
 * Writes the text and gives the SHA-256 of the bytes written: encoded to UTF-8 once for both (a
 * pack's HTML is hundreds of kilobytes), and the bytes let go on return, before any print waits.
 */
function writeHashed(path: string, text: string): string {
  const bytes = Buffer.from(text);
  writeReplacing(path, bytes);
  return sha256(bytes);
}

export async function build(opts: BuildOptions): Promise<BuildResult> {
  const log = opts.log ?? ((l: string) => process.stderr.write(`${l}\n`));
  const out = claimOut(opts.out);
  const engineFor = engineCache();
  const treeHash = cachedTreeHash();
  const result: BuildResult = { built: [], skipped: [], invalid: [], pdfSkipped: false };
  const chromium = findChromium();
  const printer = opts.printer !== undefined ? opts.printer : chromium ? lazyPrinter(chromium, opts.poolSize) : null;
  const printing: Promise<void>[] = [];
  const progress = progressLine(opts.jobs.length, opts.progress ?? process.stderr);
  const sources: SiteSource[] = [];
  const look = lookups(opts.archive ?? null, out);
  const nameOf = (dir: string) => basename(resolve(dir));
  const draftOf = (name: string) => join(out, name, 'draft');
  const first = new Map<string, number>(); // a job's name → the first job folder of the build with it
  opts.jobs.forEach((dir, i) => { if (!first.has(nameOf(dir))) first.set(nameOf(dir), i); });
  // The jobs a glance at modification times says may have changed are looked at first, so a
  // re-tested job's pack prints while the others are hashed (and the results keep the jobs' order).
  // Chromium takes seconds to start: it begins as soon as the glance says some pack will need
  // printing, alongside the look at every job (closed unused if the look finds none does)
  let warmed = false;
  const glance = opts.jobs.map((dir) => {
    const maybe = opts.force === true || (printer !== null && mayHaveChanged(dir, draftOf(nameOf(dir))));
    if (maybe && !warmed) {
      warmed = true;
      printer?.warm?.();
    }
    return maybe;
  });
  const order = [...opts.jobs.keys()].sort((x, y) => Number(glance[y]) - Number(glance[x]) || x - y);
  const rank = new Map<object, number>();
  const add = <T extends object>(list: T[], entry: T, i: number): T => (rank.set(entry, i), list.push(entry), entry);
  try {
    for (const i of order) {
      const dir = opts.jobs[i]!;
      if (printing.length > 0) await new Promise((r) => setImmediate(r)); // let the printer start while unchanged jobs are looked at
      const name = nameOf(dir);
      const twin = first.get(name)!;
      if (twin !== i) {
        const e = { file: dir, row: 1, column: 1, message: `another job folder of this build, ${opts.jobs[twin]}, has the same name; a job's name is its folder's name and its packs go to DIR/${name}/` };
        add(result.invalid, { job: name, errors: [e] }, i);
        log(formatError(e));
        continue;
      }
      const where = look.settingsOf(dir);
      const latestOf = () => look.inspect(where.archive, name).revisions.at(-1) ?? null;
      if (!opts.force && where.errors.length === 0 && unchanged(dir, draftOf(name), look.stamps.of(draftOf(name)), where.archive, latestOf()?.number ?? null, opts, printer !== null, treeHash, look.firmOf)) {
        sources.push({ job: name, archive: where.archive });
        add(result.skipped, { job: name, dir: draftOf(name) }, i);
        progress.tick(name);
        continue;
      }
      const job = loadJob(dir, opts.today ? { today: opts.today } : {});
      if (!job.ok || where.errors.length > 0) {
        const errors = [...where.errors, ...(job.ok ? [] : job.errors)];
        add(result.invalid, { job: job.raw.name, errors }, i);
        for (const e of errors) log(`${job.raw.name}/${formatError(e)}`);
        progress.tick(job.raw.name);
        continue;
      }
      const { project, assessment } = job;
      const target = draftOf(project.name);
      sources.push({ job: project.name, archive: where.archive });
      const latest = latestOf();
      const style = styleOf(project, job.raw.dir, { theme: opts.theme ?? null, ...(opts.paper ? { paper: opts.paper } : {}) }, engineFor, treeHash);
      const fingerprint: Fingerprint = {
        packsmith: buildId(),
        input_hash: combinedHash(fileHashes(job.raw.files)),
        templates_hash: style.templatesHash,
        base_revision: latest?.number ?? null,
        pdf: printer !== null,
      };
      if (!opts.force && upToDate(target, look.stamps.of(target), fingerprint)) {
        add(result.skipped, { job: project.name, dir: target }, i);
        progress.tick(project.name);
        continue;
      }
      const { date, label, data, pack } = draftPack(project, assessment, latest, style, log);

      outDir(out, project.name, 'draft');
      rmSync(join(target, STAMP_FILE), { force: true }); // a draft half rewritten is never taken as up to date
      look.stamps.wrote(target, null);
      const htmlPath = join(target, 'pack.html');
      const outputs: Record<string, string> = { 'pack.html': writeHashed(htmlPath, pack.html) };
      const built = add(result.built, { job: project.name, html: htmlPath, pdf: null as string | null }, i);
      const source = { dir: job.raw.dir, theme: ownTheme(project, job.raw.dir), paper: project.file.paper ?? null };
      // what the stamp records of the job, taken now: the closures below, which live until the
      // pack has printed, hold these and not the job, its assessment or its HTML (a large job's
      // hundreds of MB)
      const facts = { title: project.file.title, client: project.file.client.name, site: project.file.site.address, summary: assessment.summary };
      const jobName = project.name;
      const stamp = () => {
        const text = stampBytes({
          format: 'packsmith-build/1', fingerprint, archive: where.archive, title: facts.title, client: facts.client, site: facts.site,
          date, summary: facts.summary, outputs, output_stats: outputStats(target, Object.keys(outputs)), source,
        });
        writeReplacing(join(target, STAMP_FILE), text);
        look.stamps.wrote(target, text);
      };
      if (printer) {
        const pdfPath = join(target, 'pack.pdf');
        printing.push(packPdf(printer, htmlPath, project, { ...label, date: pdfDate(date) }, pack, style.paper, data).then((pdf) => {
          writeReplacing(pdfPath, pdf);
          outputs['pack.pdf'] = sha256(pdf);
          built.pdf = pdfPath;
          stamp();
          progress.tick(jobName);
        }));
        await printer.room(); // the pages print while the next packs render, without queueing the whole build
      } else {
        result.pdfSkipped = true;
        rmSync(join(target, 'pack.pdf'), { force: true }); // never leave a PDF of other inputs beside this HTML
        stamp();
        progress.tick(project.name);
      }
    }
    const settled = await Promise.allSettled(printing);
    const failed = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected');
    if (failed) throw failed.reason;
  } catch (e) {
    progress.done();
    await Promise.allSettled(printing);
    await printer?.close();
    throw e;
  }
  progress.done();
  for (const list of [result.built, result.skipped, result.invalid] as object[][]) list.sort((p, q) => rank.get(p)! - rank.get(q)!);
  const closing = printer?.close(); // Chromium ends while the site is written
  closing?.catch(() => undefined); // (a failure is thrown below, once the site is written, not reported as unhandled meanwhile)
  await new Promise((r) => setImmediate(r)); // (its end begun before the site's work takes the thread)
  try {
    if (opts.site !== false) writeSite(out, sources, look.inspect, look.stamps.of);
    else outDir(out);
    look.known.save();
  } finally {
    await closing;
  }
  return result;
}
