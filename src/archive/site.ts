// The archive site: DIR/index.html lists every job with its latest revision, its status, its
// issue dates and links to every revision's HTML and PDF; DIR/<job>/index.html lists one job.
// Plain static pages with relative links: they work from file:// and any web server, no script.
import { existsSync } from 'node:fs';
import { outDir } from './out.js';
import { join } from 'node:path';
import Handlebars from 'handlebars';
import type { Summary } from '../calc/types.js';
import { overallStatus, STATUS_LOOK } from '../render/view.js';
import { archiveJobs, inspectJob } from './verify.js';
import { readStamp } from './fingerprint.js';
import { revisionDirName } from './revisions.js';
import { writeReplacing } from './files.js';
import { withCsp } from '../render/csp.js';

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

/** What the archive folder holds for one job, read from its manifests and its draft's build.json. */
export function siteJob(out: string, job: string): SiteJob | null {
  const archive = inspectJob(out, job);
  const stamp = readStamp(join(out, job, 'draft'));
  if (archive.revisions.length === 0 && !stamp) return null;
  const revisions = archive.revisions.map((r) => ({
    name: `Revision ${r.number}`,
    date: r.manifest.revision.date,
    by: r.manifest.revision.by,
    reason: r.manifest.revision.reason,
    status: statusWord(r.manifest.summary),
    counts: countsText(r.manifest.summary),
    html: `${revisionDirName(r.number)}/pack.html`,
    pdf: `${revisionDirName(r.number)}/pack.pdf`,
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
  return {
    job,
    title: last?.manifest.title ?? stamp?.title ?? job,
    revisions,
    latest: revisions[revisions.length - 1] ?? null,
    draft,
    findings: archive.findings.length,
  };
}

const STYLE = `<style>body{font-family:"DejaVu Sans",sans-serif;max-width:60rem;margin:2rem auto;padding:0 1rem;color:#1d2329}
table{border-collapse:collapse;width:100%}td,th{border:1px solid #c9d0d6;padding:.3em .5em;text-align:left;vertical-align:top}
thead th{background:#f1f4f6}.muted{color:#5b6670}.warn{color:#a3231f;font-weight:600}</style>`;

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
<table><thead><tr><th>Job</th><th>Latest revision</th><th>Status</th><th>Issued</th><th>Packs</th></tr></thead><tbody>
{{#each jobs}}<tr><td><a href="{{href job "index.html"}}">{{title}}</a><br><span class="muted">{{job}}</span>{{#if findings}}<br><span class="warn">{{findings}} archive finding(s): run packsmith verify</span>{{/if}}</td>
<td>{{#if latest}}{{latest.name}}, {{latest.date}}{{else}}none issued{{/if}}</td>
<td>{{#if latest}}{{latest.status}}<br><span class="muted">{{latest.counts}}</span>{{else}}{{#if draft}}{{draft.status}} (draft)<br><span class="muted">{{draft.counts}}</span>{{/if}}{{/if}}</td>
<td>{{#each revisions}}{{name}}: {{date}}<br>{{/each}}</td>
<td>{{#each revisions}}{{name}}: {{> links prefix=../job}}<br>{{/each}}{{#if draft}}Draft: {{> links draft prefix=job}}{{/if}}</td></tr>
{{/each}}</tbody></table>
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
<p class="muted">Job {{job}}</p>
{{#if findings}}<p class="warn">The archive of this job has {{findings}} finding(s): run packsmith verify.</p>{{/if}}
<h2>Issued revisions</h2>
{{#if revisions.length}}
<table><thead><tr><th>Revision</th><th>Issued</th><th>By</th><th>Reason</th><th>Status</th><th>Pack</th></tr></thead><tbody>
{{#each revisions}}<tr><td>{{name}}</td><td>{{date}}</td><td>{{by}}</td><td>{{#if reason}}{{reason}}{{/if}}</td><td>{{status}}<br><span class="muted">{{counts}}</span></td><td>{{> links prefix=""}}</td></tr>
{{/each}}</tbody></table>
{{else}}<p>No revision issued yet.</p>{{/if}}
{{#if draft}}<h2>Draft</h2>
<p>Last test {{draft.date}} · {{draft.status}} <span class="muted">({{draft.counts}})</span> · {{> links draft prefix=""}}</p>{{/if}}
</body></html>
`,
  { strict: true },
);


export function renderIndex(jobs: SiteJob[]): string {
  return withCsp(indexPage({ jobs: [...jobs].sort((a, b) => a.job.localeCompare(b.job)) }));
}

export const renderJobPage = (job: SiteJob): string => withCsp(jobPage(job));

/** Write the site of the archive folder `out` from what it holds. */
export function writeSite(out: string): SiteJob[] {
  outDir(out);
  const jobs = archiveJobs(out).map((j) => siteJob(out, j)).filter((j): j is SiteJob => j !== null);
  for (const j of jobs) if (existsSync(join(out, j.job))) writeReplacing(join(outDir(out, j.job), 'index.html'), renderJobPage(j));
  writeReplacing(join(out, 'index.html'), renderIndex(jobs));
  return jobs;
}
