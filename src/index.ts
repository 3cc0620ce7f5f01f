// packsmith's public API; the command line is one caller of it.
export { readJob } from './load/job.js';
export { findFirmFile, readFirm, type Firm } from './load/firm.js';
export { validate, type Project } from './model/validate.js';
export { assess } from './calc/assess.js';
export { loadJob, type LoadedJob } from './job.js';
export { renderPack, renderPackFiles } from './render/pack.js';
export { createEngine, TemplateError } from './render/engine.js';
export { printPdf } from './print/pdf.js';
export { createPrintPool } from './print/pool.js';
export { launchBrowser, findChromium } from './print/browser.js';
export { build } from './build.js';
export { issueRevision, type IssueOptions, type IssueResult } from './issue.js';
export { verifyArchive, type Finding } from './archive/verify.js';
export { audit, type AuditScope } from './archive/audit.js';
export { writeSite } from './archive/site.js';
export type { Assessment, CheckResult, Status } from './calc/types.js';
