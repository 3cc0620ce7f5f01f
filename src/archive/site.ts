// The archive site: DIR/index.html lists every job with its latest revision, its status, its
// issue dates and links to every revision's HTML and PDF; DIR/<job>/index.html lists one job.
// Plain static pages with relative links: they work from file:// and any web server, no script.
// The revisions stay in the archive folder (kept with the jobs); the site, in out/, links them.
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { outDir } from './out.js';
import Handlebars from 'handlebars';
import type { Summary } from '../calc/types.js';
import { overallStatus, STATUS_LOOK } from '../render/status.js';
import { archiveJobs, inspectJob, type JobArchive } from './verify.js';
import { readStamp, type Stamp } from './fingerprint.js';
import { revisionDirName } from './revisions.js';
import { writeReplacing } from './files.js';
import { parseJson } from './json.js';
import { withCsp } from '../render/csp.js';
import { sitePages } from './site-pages.js';

export interface SitePack {
  name: string;
  date: string;
  status: string;
  counts: string;
  html: string;
  pdf: string | null;
}

export interface SiteJob {
  job: string;
  title: string;
  client: string | null;
  site: string | null;
  revisions: (SitePack & { by: string; reason: string | null })[];
  latest: SitePack | null;
  draft: SitePack | null;
  findings: number;
}

/** The three words of the archive: all passed, open items (a fail or a result close to its limit), not verified. */
export function statusWord(summary: Summary): string {
  const s = overallStatus({ summary });
  return s === 'pass' ? 'all passed' : s === 'not-verified' ? 'not verified' : 'open items';
}

export function countsText(summary: Summary): string {
  const parts = (['fail', 'not-verified', 'attention', 'pass'] as const).filter((s) => summary[s] > 0).map((s) => `${summary[s]} ${STATUS_LOOK[s].word}`);
  return parts.join(', ');
}

/** The client and site of an issued revision, from its data.json (null where it cannot be read). */
function partiesOf(revisionDir: string): { client: string | null; site: string | null } {
  try {
    const parsed = parseJson(readFileSync(join(revisionDir, 'data.json'), 'utf8'));
    const project = parsed.ok ? (parsed.value as { project?: { client?: { name?: unknown }; site?: { address?: unknown } } }).project : undefined;
    const text = (v: unknown) => (typeof v === 'string' ? v : null);
    return { client: text(project?.client?.name), site: text(project?.site?.address) };
  } catch {
    return { client: null, site: null };
  }
}

/** A job and the archive folder that holds its revisions. */
export interface SiteSource {
  job: string;
  archive: string;
}

/** What an archive holds for a job (the build passes its own, which remembers what it looked at). */
export type Inspect = (archive: string, job: string) => Pick<JobArchive, 'revisions' | 'findings'>;

/** Links from out/<job>/ to a file of the job's archive (relative, so the site works from disk). */
const linkTo = (out: string, job: string, archive: string, file: string): string =>
  relative(join(out, job), join(archive, job, file)).split('\\').join('/');

/** A draft folder's stamp (the build passes its own, which reads each once). */
export type StampOf = (draftDir: string) => Stamp | null;

/** What the archive holds for one job (its manifests) and its draft in `out` (its build.json). Links are relative to out/<job>/. */
export function siteJob(out: string, job: string, archiveDir: string | null = null, inspect: Inspect = inspectJob, stampOf: StampOf = readStamp): SiteJob | null {
  const stamp = stampOf(join(out, job, 'draft'));
  const where = archiveDir ?? stamp?.archive ?? null;
  const archive = where ? inspect(where, job) : { revisions: [], findings: [] };
  if (archive.revisions.length === 0 && !stamp) return null;
  const revisions = archive.revisions.map((r) => ({
    name: `Revision ${r.number}`,
    date: r.manifest.revision.date,
    by: r.manifest.revision.by,
    reason: r.manifest.revision.reason,
    status: statusWord(r.manifest.summary),
    counts: countsText(r.manifest.summary),
    html: linkTo(out, job, where!, `${revisionDirName(r.number)}/pack.html`),
    pdf: linkTo(out, job, where!, `${revisionDirName(r.number)}/pack.pdf`),
  }));
  const draft = stamp && {
    name: 'Draft',
    date: stamp.date,
    status: statusWord(stamp.summary),
    counts: countsText(stamp.summary),
    html: 'draft/pack.html',
    pdf: 'pack.pdf' in stamp.outputs ? 'draft/pack.pdf' : null,
  };
  const last = archive.revisions[archive.revisions.length - 1];
  const parties = stamp?.client !== undefined ? { client: stamp.client, site: stamp.site ?? null } : last ? partiesOf(last.dir) : { client: null, site: null };
  return {
    job,
    title: last?.manifest.title ?? stamp?.title ?? job,
    ...parties,
    revisions,
    latest: revisions[revisions.length - 1] ?? null,
    draft,
    findings: archive.findings.length,
  };
}

const STYLE = `<style>body{font-family:"DejaVu Sans",sans-serif;max-width:72rem;margin:2rem auto;padding:0 1rem;color:#1d2329}
table{border-collapse:collapse;width:100%}td,th{border:1px solid #c9d0d6;padding:.3em .5em;text-align:left;vertical-align:top}
thead th{background:#f1f4f6}.muted{color:#5b6670}.warn{color:#a3231f;font-weight:600}.date{white-space:nowrap}
.scroll{overflow-x:auto}.tools{display:flex;flex-wrap:wrap;gap:.5em 1em;align-items:center}.tools input{font:inherit;padding:.25em .4em;min-width:16em}
.tools button{font:inherit;padding:.25em .6em}@media (max-width:40rem){body{margin:1rem auto}}</style>`;

/** The index's script: filter the rows as you type (every word must match), sort them by date. */
export const SITE_SCRIPT = `(function () {
  var find = document.getElementById('find'), sort = document.getElementById('sort'), body = document.getElementById('jobs-body'), none = document.getElementById('none');
  if (!find || !sort || !body) return;
  var rows = Array.prototype.slice.call(body.rows), newest = false;
  function filter() {
    var words = find.value.toLowerCase().split(/\\s+/).filter(Boolean), shown = 0;
    rows.forEach(function (r) {
      var text = r.getAttribute('data-text');
      var hit = words.every(function (w) { return text.indexOf(w) >= 0; });
      r.hidden = !hit;
      if (hit) shown++;
    });
    if (none) none.hidden = shown > 0;
  }
  find.addEventListener('input', filter);
  sort.addEventListener('click', function () {
    newest = !newest;
    rows.sort(function (a, b) {
      var x = a.getAttribute('data-date'), y = b.getAttribute('data-date');
      return newest ? y.localeCompare(x) : x.localeCompare(y);
    });
    rows.forEach(function (r) { body.appendChild(r); });
    sort.textContent = newest ? 'Sort by date, oldest first' : 'Sort by date, newest first';
  });
  filter();
})();`;

/** The script's hash, for a Content-Security-Policy that allows exactly this inline script. */
export const SITE_SCRIPT_SHA256 = `sha256-${createHash('sha256').update(SITE_SCRIPT).digest('base64')}`;

const hb = Handlebars.create();
hb.registerPartial('links', `<a href="{{href prefix html}}">HTML</a>{{#if pdf}} · <a href="{{href prefix pdf}}">PDF</a>{{/if}}`);
// A link is always relative ("./"), each folder name percent-encoded: a job folder named
// "javascript:alert(1)" is a folder, never a scheme.
hb.registerHelper('href', (...args: unknown[]) => `./${args.slice(0, -1).flatMap((a) => String(a).split('/')).filter((p) => p !== '').map(encodeURIComponent).join('/')}`);

const indexPage = hb.compile(
  `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Completion packs</title>
${STYLE}</head>
<body><h1>Completion packs</h1>
{{#if jobs.length}}
<p class="tools"><label for="find">Find a job</label> <input type="search" id="find" placeholder="client, site, title or job" autocomplete="off"> <button type="button" id="sort">Sort by date, newest first</button></p>
<div class="scroll"><table id="jobs"><thead><tr><th>Job</th><th>Client</th><th>Site</th><th>Latest</th><th>Date</th><th>Status</th><th>Packs</th></tr></thead><tbody id="jobs-body">
{{#each jobs}}<tr data-date="{{sortDate}}" data-text="{{searchText}}"><td><a href="{{href job "index.html"}}">{{title}}</a><br><span class="muted">{{job}}</span>{{#if findings}}<br><span class="warn">{{findings}} archive finding(s): run packsmith verify</span>{{/if}}</td>
<td>{{#if client}}{{client}}{{/if}}</td><td>{{#if site}}{{site}}{{/if}}</td>
<td>{{#if latest}}{{latest.name}}{{else}}{{#if draft}}Draft only{{else}}none issued{{/if}}{{/if}}</td>
<td class="date">{{#if latest}}{{latest.date}}{{else}}{{#if draft}}{{draft.date}}{{/if}}{{/if}}</td>
<td>{{#if latest}}{{latest.status}}<br><span class="muted">{{latest.counts}}</span>{{else}}{{#if draft}}{{draft.status}} (draft)<br><span class="muted">{{draft.counts}}</span>{{/if}}{{/if}}</td>
<td>{{#each revisions}}<span class="date">{{name}}: {{> links prefix=../job}}</span><br>{{/each}}{{#if draft}}<span class="date">Draft: {{> links draft prefix=job}}</span>{{/if}}</td></tr>
{{/each}}</tbody></table></div>
<p id="none" class="muted" hidden>No job matches.</p>
<script>${SITE_SCRIPT}</script>
{{else}}<p>Nothing built or issued yet.</p>{{/if}}
</body></html>
`,
  { strict: true },
);

const jobPage = hb.compile(
  `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>{{title}} — completion packs</title>
${STYLE}</head>
<body><p><a href="../index.html">All jobs</a></p>
<h1>{{title}}</h1>
<p class="muted">Job {{job}}{{#if client}} · {{client}}{{/if}}{{#if site}} · {{site}}{{/if}}</p>
{{#if findings}}<p class="warn">The archive of this job has {{findings}} finding(s): run packsmith verify.</p>{{/if}}
<h2>Issued revisions</h2>
{{#if revisions.length}}
<div class="scroll"><table><thead><tr><th>Revision</th><th>Issued</th><th>By</th><th>Reason</th><th>Status</th><th>Pack</th></tr></thead><tbody>
{{#each revisions}}<tr><td>{{name}}</td><td class="date">{{date}}</td><td>{{by}}</td><td>{{#if reason}}{{reason}}{{/if}}</td><td>{{status}}<br><span class="muted">{{counts}}</span></td><td>{{> links prefix=""}}</td></tr>
{{/each}}</tbody></table></div>
{{else}}<p>No revision issued yet.</p>{{/if}}
{{#if draft}}<h2>Draft</h2>
<p>Last test <span class="date">{{draft.date}}</span> · {{draft.status}} <span class="muted">({{draft.counts}})</span> · {{> links draft prefix=""}}</p>{{/if}}
</body></html>
`,
  { strict: true },
);


export function renderIndex(jobs: SiteJob[]): string {
  const rows = [...jobs].sort((a, b) => a.job.localeCompare(b.job)).map((j) => ({
    ...j,
    sortDate: j.latest?.date ?? j.draft?.date ?? '',
    searchText: [j.job, j.title, j.client, j.site].filter(Boolean).join(' ').toLowerCase(),
  }));
  return withCsp(indexPage({ jobs: rows }), [SITE_SCRIPT_SHA256]);
}

export const renderJobPage = (job: SiteJob): string => withCsp(jobPage(job));

/**
 * Write the site in `out`: every job with a draft there (its build.json names its archive), every
 * job of `sources`, and every other job of their archive folders.
 */
export function writeSite(out: string, sources: SiteSource[] = [], inspect: Inspect = inspectJob, stampOf: StampOf = readStamp): SiteJob[] {
  outDir(out);
  const where = new Map<string, string | null>();
  for (const name of readdirSync(out, { withFileTypes: true })) {
    if (name.isDirectory() && !name.name.startsWith('.')) where.set(name.name, null);
  }
  for (const a of new Set(sources.map((s) => s.archive))) for (const j of archiveJobs(a)) where.set(j, a);
  for (const s of sources) where.set(s.job, s.archive);
  const jobs = [...where].map(([j, a]) => siteJob(out, j, a, inspect, stampOf)).filter((j): j is SiteJob => j !== null);
  const pages = sitePages(out); // a page whose input is as when it was written is not rendered again
  for (const j of jobs) {
    if (pages.current([j.job, 'index.html'], j)) continue;
    writeChanged(join(outDir(out, j.job), 'index.html'), renderJobPage(j));
    pages.wrote([j.job, 'index.html']);
  }
  if (!pages.current(['index.html'], [...jobs].sort((a, b) => a.job.localeCompare(b.job)))) {
    writeChanged(join(out, 'index.html'), renderIndex(jobs));
    pages.wrote(['index.html']);
  }
  pages.save();
  return jobs;
}

/** Write a page of the site only where it differs from what is there: a build that changed one job rewrites that job's page and the index. */
function writeChanged(path: string, text: string): void {
  if (existsSync(path) && readFileSync(path, 'utf8') === text) return;
  writeReplacing(path, text);
}
