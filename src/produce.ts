// One pack's files, made the same way for a draft and for a revision: the HTML (and the PDF's
// running header and footer) through the job's theme, then the PDF printed from that HTML file by
// a pool of pages on one Chromium, with fixed metadata and data.json inside.
import { resolve } from 'node:path';
import type { Project } from './model/validate.js';
import type { Paper } from './model/schema.js';
import type { Assessment } from './calc/types.js';
import type { Changes } from './render/view.js';
import { BUILTIN_TEMPLATES, type Engine } from './render/engine.js';
import { renderPackFiles, type RenderedPack } from './render/pack.js';
import { clearStaleProfiles, launchBrowser, type PrintBrowser } from './print/browser.js';
import { createPrintPool, roomLimit, type PrintPool } from './print/pool.js';
import type { PdfMetadata } from './print/metadata.js';
import { combinedHash, fileHashes, readTree, sha256 } from './archive/hash.js';
import { VERSION } from './version.js';

/** What a pack says it is: "DRAFT" with its last test date, or "Revision N" with its issue date. */
export interface PackLabel {
  label: string;
  draft: boolean;
  date: string;
  /** issued although checks failed or are not verified (--accept-open-items) */
  acceptedOpenItems?: boolean;
  /** fingerprint of the firm key that signs the revision (printed on the sign-off page) */
  keyFingerprint?: string | null;
}

/** How a job's packs look: its theme's engine, its paper, and a hash of every template used. */
export interface PackStyle {
  engine: Engine;
  paper: Paper;
  /** the built-in templates, the theme's files and the paper: a change to any rebuilds the pack */
  templatesHash: string;
}

/** The style of one job: `--theme`/`--paper` where given, else the job's own, else the built-ins and A4. */
export function styleOf(
  project: Project, jobDir: string, given: { theme?: string | null; paper?: Paper },
  engineFor: (theme: string | null) => Engine, treeHash: (dir: string) => string = cachedTreeHash(),
): PackStyle {
  const theme = given.theme ?? ownTheme(project, jobDir);
  const paper = given.paper ?? project.file.paper ?? 'A4';
  return { engine: engineFor(theme), paper, templatesHash: templatesHash(theme, paper, treeHash) };
}

/** The theme folder a job names itself (absolute), or null. */
export const ownTheme = (project: Project, jobDir: string): string | null => (project.file.theme ? resolve(jobDir, project.file.theme) : null);

/** One hash of the built-in templates, the theme's files and the paper. */
export function templatesHash(theme: string | null, paper: string, treeHash: (dir: string) => string): string {
  return sha256([treeHash(BUILTIN_TEMPLATES), theme ? treeHash(theme) : 'no theme', paper].join('\n'));
}

/** The hash of a folder's files, each folder read once per run. */
export function cachedTreeHash(): (dir: string) => string {
  const seen = new Map<string, string>();
  return (dir) => {
    let h = seen.get(dir);
    if (h === undefined) {
      h = combinedHash(fileHashes(readTree(dir)));
      seen.set(dir, h);
    }
    return h;
  };
}

export function packFiles(project: Project, assessment: Assessment, label: PackLabel, changes: Changes | null, style: PackStyle): RenderedPack {
  return renderPackFiles(project, assessment, { revisionLabel: label.label, draft: label.draft, date: label.date, paper: style.paper, changes, acceptedOpenItems: label.acceptedOpenItems ?? false, keyFingerprint: label.keyFingerprint ?? null }, style.engine);
}

/**
 * Print a pack. Not an async function: what it is given (the job, the pack's HTML) is not held
 * while the pack prints, only the metadata made from it and the running header and footer.
 */
export function packPdf(
  printer: Printer, htmlPath: string, project: Project, label: PackLabel, pack: Pick<RenderedPack, 'header' | 'footer'>, paper: Paper, dataJson: string,
): Promise<Uint8Array> {
  // the metadata goes in as the PDF is made (a large pack's is joined from parts straight to a file)
  const metadata: PdfMetadata = {
    title: `${project.file.title} — ${label.label}`,
    author: project.file.installer.firm,
    subject: project.name,
    keywords: [project.name, label.label],
    date: label.date,
    producer: `packsmith ${VERSION}`,
    creator: 'packsmith',
    attachments: [{ name: 'data.json', bytes: Buffer.from(dataJson), mimeType: 'application/json', description: 'The validated job data and its assessment' }],
  };
  return printer.print(htmlPath, { header: pack.header, footer: pack.footer, format: paper, metadata }).then((r) => r.pdf);
}

/** A pool of print pages on one Chromium, started the first time a pack needs printing (a build with nothing to print starts none). */
export interface Printer {
  print: PrintPool['print'];
  /** resolves when the pool has room for another pack (so rendering runs ahead of printing, but not the whole build) */
  room(): Promise<void>;
  /**
   * Start what printing needs now, before the first pack is ready: Chromium and a first page, and
   * the PDF library. A build calls it when a pack will likely need printing; unused, close() ends it.
   */
  warm?(): void;
  close(): Promise<void>;
}

/** The Chromium that every printer of this process shares, when `shareOneBrowser` asked for one (else each printer starts its own). */
let shared: { chromium: string; browser: Promise<PrintBrowser> | null } | null = null;

/**
 * Keep one Chromium for every printer of this process until the returned close() (the test
 * suite's in-process runs of the command line, which need not start a browser each): a printer
 * then closes its pages but leaves the browser running.
 */
export function shareOneBrowser(): { close(): Promise<void> } {
  shared = { chromium: '', browser: null };
  return {
    close: async () => {
      const kept = shared?.browser;
      shared = null;
      if (kept) await (await kept).close();
    },
  };
}

function browserFor(chromium: string): Promise<PrintBrowser> {
  if (!shared) return launchBrowser(chromium);
  const kept = shared.browser;
  if (kept && shared.chromium === chromium) {
    return kept.then((b) => (b.browser.connected ? b : ((shared!.browser = launchBrowser(chromium)))));
  }
  shared.chromium = chromium;
  return (shared.browser = launchBrowser(chromium));
}

export function lazyPrinter(chromium: string, poolSize?: number): Printer {
  clearStaleProfiles(); // what runs killed outright left, printing or not this time
  let started: Promise<{ browser: PrintBrowser; pool: PrintPool; own: boolean }> | null = null;
  let ready: PrintPool | null = null;
  let early = 0; // packs handed over while Chromium starts
  const start = () => (started ??= browserFor(chromium).then((browser) => {
    ready = createPrintPool(browser, poolSize);
    return { browser, pool: ready, own: shared === null };
  }));
  return {
    print: async (htmlPath, opts) => {
      early++;
      let s;
      try {
        s = await start();
      } finally {
        early--;
      }
      return s.pool.print(htmlPath, opts);
    },
    // while Chromium starts, the build goes on (looking at the other jobs) with as many packs
    // handed over as the pool would hold queued, instead of waiting for the start
    room: async () => {
      if (!started) return;
      if (!ready && early < roomLimit(poolSize)) return;
      await (await started).pool.room();
    },
    warm: () => {
      // a failed start is reported by the first print that needs it, not here
      start().then(({ pool }) => pool.warm(), () => undefined);
      import('pdf-lib').catch(() => undefined);
    },
    close: async () => {
      if (!started) return;
      const s = await started.catch(() => null); // started by warm() and failed: nothing to close
      if (!s) return;
      if (s.own) await s.browser.close(); // its pages end with it
      else await s.pool.close();
    },
  };
}
