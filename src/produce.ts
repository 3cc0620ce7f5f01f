// One pack's files, made the same way for a draft and for a revision: the HTML through the
// templates, then the PDF printed from that HTML file, with fixed metadata and data.json inside.
import type { Browser } from 'puppeteer-core';
import type { Project } from './model/validate.js';
import type { Assessment } from './calc/types.js';
import type { Changes } from './render/view.js';
import type { Engine } from './render/engine.js';
import { renderPack } from './render/pack.js';
import { launchBrowser, type PrintBrowser } from './print/browser.js';
import { printPdf } from './print/pdf.js';
import { setPdfMetadata } from './print/metadata.js';
import { VERSION } from './version.js';

/** What a pack says it is: "DRAFT" with its last test date, or "Revision N" with its issue date. */
export interface PackLabel {
  label: string;
  draft: boolean;
  date: string;
}

export function packHtml(project: Project, assessment: Assessment, label: PackLabel, changes: Changes | null, engine: Engine): string {
  return renderPack(project, assessment, { revisionLabel: label.label, draft: label.draft, date: label.date, changes }, engine);
}

export async function packPdf(browser: Browser, htmlPath: string, project: Project, label: PackLabel, dataJson: string): Promise<Uint8Array> {
  const { pdf } = await printPdf(browser, htmlPath, {
    footerLeft: project.file.title,
    footerMiddle: label.draft ? 'DRAFT' : `${label.label} · ${label.date}`,
  });
  return setPdfMetadata(pdf, {
    title: `${project.file.title} — ${label.label}`,
    author: project.file.installer.firm,
    subject: project.name,
    keywords: [project.name, label.label],
    date: label.date,
    producer: `packsmith ${VERSION}`,
    creator: 'packsmith',
    attachments: [{ name: 'data.json', bytes: Buffer.from(dataJson), mimeType: 'application/json', description: 'The validated job data and its assessment' }],
  });
}

/** One Chromium, started the first time a pack needs printing (a build with nothing to print starts none). */
export function lazyBrowser(chromium: string) {
  let started: Promise<PrintBrowser> | null = null;
  return {
    get: async (): Promise<Browser> => (await (started ??= launchBrowser(chromium))).browser,
    close: async (): Promise<void> => {
      if (started) await (await started).close();
    },
  };
}
