// `packsmith serve`: the live drafts, the session form and the archive site over HTTP (node:http:
// a handful of routes need no framework, and every request passes the same guard first).
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { basename, dirname, join, resolve, sep } from 'node:path';
import type { AddressInfo } from 'node:net';
import { LiveJobs, NoChromium, type LiveJob } from './jobs.js';
import { Events } from './events.js';
import { guard, isLoopback } from './guard.js';
import { contentType, fileInside } from './files.js';
import { watchPaths, type Watcher } from './watch.js';
import { draftLine, draftPage, errorsPage, formPage, indexPage, messagePage, nonceStyles } from './pages.js';
import { saveSession, type SessionInput } from './session.js';
import { READING_COLUMNS, type ReadingField } from '../model/schema.js';
import { NO_CHROMIUM_HELP } from '../print/browser.js';
import { archiveSettings, jobArchiveSettings } from '../archive/location.js';
import { today } from '../commands/today.js';

export interface ServeOptions {
  /** a folder of job folders (default projects/), or one job folder */
  folder: string;
  /** where `build` leaves drafts and the archive site (default out/) */
  out: string;
  host: string;
  /** 0: any free port */
  port: number;
  log?: (line: string) => void;
  /** told each time a job's draft was rendered again (for the bench) */
  onRender?: (job: string, version: number, ms: number) => void;
}

export interface Serving {
  url: string;
  port: number;
  /** required with a host beyond loopback; already part of `url` */
  token: string | null;
  jobs: LiveJobs;
  close(): Promise<void>;
}

/** How long to wait after a change for more changes of the same job (an editor writing in steps). */
const SETTLE_MS = 15;
const MAX_BODY = 2 * 1024 * 1024;

const BASE_HEADERS = {
  'X-Content-Type-Options': 'nosniff',
  // same-origin, not no-referrer: under no-referrer Chromium posts forms with "Origin: null", which the guard refuses
  'Referrer-Policy': 'same-origin',
  'X-Frame-Options': 'DENY',
  'Cross-Origin-Opener-Policy': 'same-origin',
  'Cross-Origin-Resource-Policy': 'same-origin',
  'Cache-Control': 'no-store',
};

/** The pages' policy: scripts and styles only with this response's nonce, nothing from elsewhere. */
export const csp = (nonce: string, scripts: boolean): string => [
  "default-src 'none'",
  scripts ? `script-src 'nonce-${nonce}'` : "script-src 'none'",
  `style-src 'nonce-${nonce}'`,
  "img-src 'self' data:",
  "connect-src 'self'",
  "form-action 'self'",
  "base-uri 'none'",
  "frame-ancestors 'none'",
].join('; ');

const FIELDS = new Set<string>(READING_COLUMNS.filter((c) => c !== 'board' && c !== 'ref' && c !== 'tested_by'));

/** The form's fields: `date`, `label`, `tested_by` and `v|<board>/<ref>|<field>` for each reading. */
export function sessionInput(params: URLSearchParams): SessionInput {
  const values = new Map<string, Partial<Record<ReadingField, string>>>();
  for (const [name, value] of params) {
    if (!name.startsWith('v|')) continue;
    const bar = name.lastIndexOf('|');
    const key = name.slice(2, bar);
    const field = name.slice(bar + 1);
    if (bar <= 2 || !key.includes('/') || !FIELDS.has(field)) continue;
    const v = values.get(key) ?? {};
    v[field as ReadingField] = value;
    values.set(key, v);
  }
  return { date: params.get('date') ?? '', label: params.get('label') ?? '', testedBy: params.get('tested_by') ?? '', values };
}

function readBody(req: IncomingMessage): Promise<string | null> {
  return new Promise((resolveBody, reject) => {
    let size = 0;
    const parts: Buffer[] = [];
    req.on('data', (d: Buffer) => {
      size += d.length;
      if (size > MAX_BODY) { resolveBody(null); req.destroy(); return; }
      parts.push(d);
    });
    req.on('end', () => resolveBody(Buffer.concat(parts).toString('utf8')));
    req.on('error', reject);
  });
}

export async function serve(opts: ServeOptions): Promise<Serving> {
  const log = opts.log ?? ((l: string) => process.stderr.write(`${l}\n`));
  const out = resolve(opts.out);
  const jobs = new LiveJobs({ root: opts.folder, out, log });
  const token = isLoopback(opts.host) ? null : randomBytes(24).toString('base64url');
  // the archive the served jobs issue to (the firm file's `archive:`, else archive/ beside their folder)
  const archiveAt = (jobs.single ? jobArchiveSettings(jobs.root) : archiveSettings(jobs.root)).archive;
  const archiveDir = existsSync(archiveAt) ? archiveAt : null;
  const events = new Events();
  let port = 0;

  const timers = new Map<string, NodeJS.Timeout>();
  let watcher: Watcher | null = null;
  const renderNow = (name: string) => {
    const changed = jobs.render(name);
    const job = jobs.get(name);
    if (!job) return;
    if (job.theme) watcher?.add([job.theme]);
    if (changed) {
      opts.onRender?.(name, job.version, job.renderMs);
      events.reload(name, job.version);
      log(`${name}: ${job.draft ? 'draft' : `${job.errors.length} problem(s)`}, rendered in ${Math.round(job.renderMs)} ms`);
    }
  };
  const schedule = (name: string) => {
    clearTimeout(timers.get(name));
    timers.set(name, setTimeout(() => { timers.delete(name); renderNow(name); }, SETTLE_MS));
  };
  const everything = () => {
    jobs.forgetStyles();
    jobs.rescan();
    for (const j of jobs.list()) schedule(j.name);
  };
  const themes = () => jobs.list().map((j) => j.theme).filter((t): t is string => t !== null);
  const changed = (path: string) => {
    const p = resolve(path);
    const owner = jobs.owner(p);
    if (basename(p) === 'packsmith.yaml' && !owner) return everything();
    if (themes().some((t) => p === t || p.startsWith(t + sep))) return everything();
    if (owner) return schedule(owner.name);
    if (p.startsWith(jobs.root + sep)) {
      // a job folder added or removed
      const before = new Set(jobs.list().map((j) => j.name));
      for (const name of jobs.rescan()) schedule(name);
      const after = new Set(jobs.list().map((j) => j.name));
      for (const name of before) if (!after.has(name)) events.reload(name, -1);
    }
  };

  jobs.rescan();
  for (const j of jobs.list()) renderNow(j.name);
  watcher = await watchPaths([jobs.root, ...themes()], [dirname(jobs.root)], changed);

  const send = (req: IncomingMessage, res: ServerResponse, status: number, body: string | Uint8Array, type: string, extra: Record<string, string> = {}) => {
    res.writeHead(status, { ...BASE_HEADERS, 'Content-Type': type, 'Content-Length': String(Buffer.byteLength(body)), ...extra });
    res.end(req.method === 'HEAD' ? undefined : body);
  };
  const sendPage = (req: IncomingMessage, res: ServerResponse, status: number, body: string, nonce: string, scripts = true) =>
    send(req, res, status, body, 'text/html; charset=utf-8', { 'Content-Security-Policy': csp(nonce, scripts) });
  const redirect = (res: ServerResponse, to: string, extra: Record<string, string> = {}) => {
    res.writeHead(303, { ...BASE_HEADERS, Location: to, ...extra });
    res.end();
  };
  const sendFile = (req: IncomingMessage, res: ServerResponse, root: string | null, rest: string, nonce: string) => {
    const file = root === null ? null : fileInside(root, rest);
    if (file === null) return sendPage(req, res, 404, messagePage('Not found', 'There is no such file in the archive.', nonce), nonce);
    const type = contentType(file);
    if (type.startsWith('text/html')) return sendPage(req, res, 200, nonceStyles(readFileSync(file, 'utf8'), nonce), nonce, false);
    return send(req, res, 200, readFileSync(file), type);
  };

  async function jobRoute(req: IncomingMessage, res: ServerResponse, job: LiveJob, rest: string, nonce: string): Promise<void> {
    if (rest === '/' && req.method !== 'POST') {
      const saved = new URL(req.url ?? '/', 'http://x').searchParams.get('saved');
      return sendPage(req, res, 200, draftPage(job, nonce, saved && /^readings\/[\w.-]+\.csv$/.test(saved) ? saved : null), nonce);
    }
    if (rest === '/patch' && req.method !== 'POST') {
      // what an open draft of version `from` swaps to show the current one (or: load the page again)
      const from = Number(new URL(req.url ?? '/', 'http://x').searchParams.get('from'));
      const patch = Number.isInteger(from) ? jobs.patch(job.name, from) : null;
      return send(req, res, 200, JSON.stringify(patch ? { ...patch, line: draftLine(job) } : { reload: true }), 'application/json; charset=utf-8');
    }
    if (rest === '/pack.pdf' && req.method !== 'POST') {
      if (!job.draft) return sendPage(req, res, 409, errorsPage(job, nonce), nonce);
      try {
        const pdf = await job.draft.print();
        return send(req, res, 200, pdf, 'application/pdf', { 'Content-Disposition': `inline; filename="${job.name.replace(/[^A-Za-z0-9._-]/g, '_')}-draft.pdf"` });
      } catch (e) {
        if (e instanceof NoChromium) return sendPage(req, res, 503, messagePage('No PDF', NO_CHROMIUM_HELP, nonce), nonce);
        throw e;
      }
    }
    if (rest === '/record') {
      if (!job.draft) return sendPage(req, res, 409, errorsPage(job, nonce), nonce);
      const project = job.draft.project;
      if (req.method !== 'POST') {
        const input = { date: today(), label: '', testedBy: '', values: new Map() };
        return sendPage(req, res, 200, formPage(job, project, { input, result: null, fresh: true }, nonce), nonce);
      }
      if (!(req.headers['content-type'] ?? '').startsWith('application/x-www-form-urlencoded')) {
        return sendPage(req, res, 415, messagePage('Not saved', 'The session form sends application/x-www-form-urlencoded.', nonce), nonce);
      }
      const body = await readBody(req);
      if (body === null) return sendPage(req, res, 413, messagePage('Not saved', 'The form sent too much.', nonce), nonce);
      const input = sessionInput(new URLSearchParams(body));
      const result = saveSession(job.dir, input);
      if (!result.ok) return sendPage(req, res, 422, formPage(job, project, { input, result, fresh: false }, nonce), nonce);
      log(`${job.name}: saved ${result.file}`);
      clearTimeout(timers.get(job.name));
      renderNow(job.name);
      return redirect(res, `/job/${encodeURIComponent(job.name)}/?saved=${encodeURIComponent(result.file)}`);
    }
    return sendPage(req, res, 404, messagePage('Not found', 'No such page.', nonce), nonce);
  }

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const nonce = randomBytes(16).toString('base64');
    const verdict = guard(req, { host: opts.host, port: () => port, token });
    if (!verdict.ok) return send(req, res, verdict.status, `${verdict.message}\n`, 'text/plain; charset=utf-8');
    if (verdict.redirect) return redirect(res, verdict.redirect, verdict.setCookie ? { 'Set-Cookie': verdict.setCookie } : {});
    if (req.method !== 'GET' && req.method !== 'HEAD' && req.method !== 'POST') {
      return send(req, res, 405, 'GET, HEAD or POST\n', 'text/plain; charset=utf-8', { Allow: 'GET, HEAD, POST' });
    }
    const url = new URL(req.url ?? '/', 'http://x');
    const path = url.pathname;
    const jobMatch = /^\/job\/([^/]+)(\/.*)?$/.exec(path);
    if (req.method === 'POST' && !(jobMatch && jobMatch[2] === '/record')) {
      return send(req, res, 405, 'only the session form takes a POST\n', 'text/plain; charset=utf-8', { Allow: 'GET, HEAD' });
    }
    if (path === '/') {
      return sendPage(req, res, 200, indexPage(jobs.list(), nonce, { archiveSite: existsSync(join(out, 'index.html')), archive: archiveDir !== null }), nonce);
    }
    if (path === '/events') {
      const job = url.searchParams.get('job');
      return events.listen(res, job === null || job === '' ? null : job, BASE_HEADERS, job ? jobs.get(job)?.version : undefined);
    }
    if (jobMatch) {
      let name: string;
      try {
        name = decodeURIComponent(jobMatch[1]!);
      } catch {
        name = '';
      }
      const job = jobs.get(name);
      if (!job) return sendPage(req, res, 404, messagePage('Not found', `No job "${name}" here.`, nonce), nonce);
      if (jobMatch[2] === undefined) return redirect(res, `/job/${encodeURIComponent(name)}/`);
      renderNow(name); // a save the watcher has not reported (yet) is rendered now: render() reads and hashes the files, and renders only when they changed
      return jobRoute(req, res, jobs.get(name) ?? job, jobMatch[2], nonce);
    }
    if (path === '/site' || path === '/archive') return redirect(res, `${path}/`);
    if (path.startsWith('/site/')) return sendFile(req, res, out, path.slice('/site/'.length), nonce);
    if (path.startsWith('/archive/')) return sendFile(req, res, archiveDir, path.slice('/archive/'.length), nonce);
    return sendPage(req, res, 404, messagePage('Not found', 'No such page.', nonce), nonce);
  }

  const server = createServer((req, res) => {
    handle(req, res).catch((e: unknown) => {
      log(`packsmith serve: ${req.method} ${req.url}: ${e instanceof Error ? e.message : String(e)}`);
      if (!res.headersSent) send(req, res, 500, 'the server could not answer this request; see its log\n', 'text/plain; charset=utf-8');
      else res.end();
    });
  });
  await new Promise<void>((ok, fail) => {
    server.once('error', fail);
    server.listen(opts.port, opts.host, () => { server.off('error', fail); ok(); });
  });
  port = (server.address() as AddressInfo).port;
  const shownHost = opts.host.includes(':') ? `[${opts.host}]` : opts.host;
  return {
    url: `http://${shownHost}:${port}/${token ? `?token=${token}` : ''}`,
    port,
    token,
    jobs,
    close: async () => {
      for (const t of timers.values()) clearTimeout(t);
      events.close();
      await watcher?.close();
      server.closeAllConnections();
      await new Promise<void>((ok) => server.close(() => ok()));
      await jobs.close();
    },
  };
}
