// The pages the server makes: the index of live jobs, a draft (the pack with a bar on top), a
// job's errors in place of its pack, and the form that records a test session.
import { formatError, type LocatedError } from '../load/raw.js';
import { circuitKey } from '../model/readings.js';
import type { Project } from '../model/validate.js';
import type { Reading } from '../model/units.js';
import { countsText, statusWord } from '../archive/site.js';
import { html, trusted, type Html } from './html.js';
import { FORM_SCRIPT, RELOAD_SCRIPT } from './client.js';
import { cellKey, fieldsFor, type SaveResult, type SessionInput } from './session.js';
import type { LiveJob } from './jobs.js';

const CSS = `body{font-family:"DejaVu Sans",system-ui,sans-serif;margin:0 auto;max-width:64rem;padding:0 1rem 3rem;color:#1d2329;line-height:1.4}
a{color:#0b4f8a}h1{font-size:1.4rem}h2{font-size:1.15rem;margin-top:1.6rem}
table{border-collapse:collapse;width:100%}td,th{border:1px solid #c9d0d6;padding:.35em .5em;text-align:left;vertical-align:top}
thead th{background:#f1f4f6}.muted{color:#5b6670}.bad{color:#a3231f;font-weight:600}
pre.src{background:#f6f7f8;border-left:3px solid #a3231f;padding:.4em .6em;overflow-x:auto;margin:.3em 0 1em}
.bar{display:flex;flex-wrap:wrap;gap:.4rem 1rem;padding:.6rem 0;border-bottom:1px solid #c9d0d6;margin-bottom:1rem}
fieldset{border:1px solid #c9d0d6;border-radius:4px;margin:0 0 1rem;padding:.5rem .75rem .75rem;min-width:0}
legend{font-weight:600;padding:0 .3rem}
.grid{display:grid;grid-template-columns:repeat(auto-fill,minmax(10.5rem,1fr));gap:.6rem .9rem}
.field label{display:block;font-size:.9rem}.field .unit{color:#5b6670;font-size:.8rem}
input,select,button{font:inherit;font-size:16px}input,select{width:100%;box-sizing:border-box;padding:.45em .5em;border:1px solid #8a949c;border-radius:3px}
input:focus,select:focus,button:focus{outline:3px solid #f0b400;outline-offset:1px}
input[aria-invalid=true],select[aria-invalid=true]{border:2px solid #a3231f;background:#fff4f3}
.err{display:block;color:#a3231f;font-size:.85rem;margin-top:.2rem}
.was{display:block;color:#5b6670;font-size:.8rem}
.session{display:grid;grid-template-columns:repeat(auto-fill,minmax(12rem,1fr));gap:.6rem .9rem;margin-bottom:1rem}
.actions{position:sticky;bottom:0;background:#fff;padding:.6rem 0;border-top:1px solid #c9d0d6;display:flex;gap:.8rem;flex-wrap:wrap;align-items:center}
button{padding:.55em 1.1em;border-radius:3px;border:1px solid #0b4f8a;background:#0b4f8a;color:#fff;cursor:pointer}
button.plain{background:#fff;color:#0b4f8a}
.notice{background:#eef6ee;border:1px solid #7aa77a;padding:.5em .75em;border-radius:3px}
@media (max-width:480px){body{padding:0 .6rem 3rem}.grid{grid-template-columns:1fr 1fr}.hint{display:none}}`;

/**
 * What a page shows: a job's draft or errors of some version, or every job (null); it is brought
 * up to date when that changes, in place where `patch` (a draft), else by loading it again.
 */
type Shows = { job: string | null; version: number; patch?: boolean };

const reloadScript = (nonce: string, shows: Shows): Html =>
  html`<script nonce="${nonce}" data-job="${shows.job ?? ''}" data-version="${shows.version}" data-patch="${shows.patch ? '1' : '0'}">${trusted(RELOAD_SCRIPT)}</script>`;

/** A page; `shows` adds the script that reloads it when what it shows changes. */
function page(title: string, nonce: string, body: Html, shows?: Shows): string {
  return html`<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${title}</title><style nonce="${nonce}">${trusted(CSS)}</style></head>
<body>${body}
${shows === undefined ? '' : reloadScript(nonce, shows)}
</body></html>
`.text;
}

const jobPath = (name: string): string => `/job/${encodeURIComponent(name)}/`;

export function indexPage(jobs: LiveJob[], nonce: string, site: { archiveSite: boolean; archive: boolean }): string {
  const rows = jobs.map((j) => html`<tr><td><a href="${jobPath(j.name)}">${j.title}</a><br><span class="muted">${j.name}</span></td>
<td>${j.draft ? html`${statusWord(j.draft.summary)}<br><span class="muted">${countsText(j.draft.summary)}</span>` : html`<span class="bad">${j.errors.length} problem${j.errors.length === 1 ? '' : 's'} in the job folder</span>`}</td>
<td><a href="${jobPath(j.name)}">Draft</a> · <a href="${jobPath(j.name)}record">Record a test session</a>${j.draft ? html` · <a href="${jobPath(j.name)}pack.pdf">PDF</a>` : ''}</td></tr>`);
  return page('packsmith serve', nonce, html`<h1>Jobs</h1>
<p class="muted">Drafts are rendered again whenever a job's files are saved; an open draft brings itself up to date in place.</p>
${jobs.length ? html`<table><thead><tr><th>Job</th><th>Draft status</th><th>Open</th></tr></thead><tbody>${rows}</tbody></table>` : html`<p>No job folders (folders holding a project.yaml) here.</p>`}
${site.archiveSite ? html`<p><a href="/site/index.html">The archive site</a> (built drafts and issued revisions, as <code>packsmith build</code> left them)</p>` : ''}
${site.archive ? html`<p><a href="/archive/">The archive folder</a> (issued revisions)</p>` : ''}`, { job: null, version: 0 });
}

/** The draft's version, as the bar shows it. */
export const draftLine = (job: LiveJob): string => `Draft ${job.version}, rendered in ${Math.round(job.renderMs)} ms`;

/** A bar on top of a served draft: not part of the pack, never printed. */
function draftBar(job: LiveJob, nonce: string, saved: string | null): string {
  return html`<style nonce="${nonce}">.ps-serve{font:14px/1.4 "DejaVu Sans",sans-serif;display:flex;flex-wrap:wrap;gap:.3rem 1rem;padding:.5rem 1rem;background:#f1f4f6;border-bottom:1px solid #c9d0d6}@media print{.ps-serve{display:none}}</style>
<nav class="ps-serve" aria-label="packsmith serve"><a href="/">All jobs</a><a href="${jobPath(job.name)}record">Record a test session</a><a href="${jobPath(job.name)}pack.pdf">PDF</a><span id="ps-draft">${draftLine(job)}</span>${saved ? html`<strong role="status">Saved ${saved}</strong>` : ''}</nav>`.text;
}

/** Give every style element of a page the response's nonce. */
export const nonceStyles = (text: string, nonce: string): string => text.replace(/<style(?=[\s>])/g, `<style nonce="${nonce}"`);

/** A job's draft as served; `saved` names the session file just saved from the form. */
export function draftPage(job: LiveJob, nonce: string, saved: string | null = null): string {
  if (!job.draft) return errorsPage(job, nonce);
  // the pack's own policy (no script at all, for a file opened from disk) gives way to the response's, as strict but for the nonce
  let text = nonceStyles(job.draft.html, nonce).replace(/<meta http-equiv="Content-Security-Policy"[^>]*>/i, '');
  const open = /<body[^>]*>/.exec(text);
  const bar = draftBar(job, nonce, saved);
  text = open ? text.slice(0, open.index + open[0].length) + bar + text.slice(open.index + open[0].length) : bar + text;
  const script = reloadScript(nonce, { job: job.name, version: job.version, patch: true }).text;
  const close = text.lastIndexOf('</body>');
  return close >= 0 ? text.slice(0, close) + script + text.slice(close) : text + script;
}

/** The line of the file an error points at, with a mark under its column. */
function sourceLine(files: Map<string, Buffer>, e: LocatedError): Html {
  const bytes = files.get(e.file);
  if (!bytes) return html``;
  const line = bytes.toString('utf8').split(/\r?\n/)[e.row - 1];
  if (line === undefined) return html``;
  // the column counts cells in a CSV file, characters in YAML: mark the cell's start in a CSV
  let at = e.column - 1;
  if (e.file.endsWith('.csv')) {
    let n = 1;
    at = 0;
    for (let i = 0; i < line.length && n < e.column; i++) if (line[i] === ',') { n++; at = i + 1; }
  }
  return html`<pre class="src">${e.row} | ${line}\n${' '.repeat(String(e.row).length + 3 + Math.min(at, line.length))}^</pre>`;
}

export function errorsPage(job: LiveJob, nonce: string): string {
  return page(`${job.name}: problems`, nonce, html`<div class="bar"><a href="/">All jobs</a></div>
<h1>${job.title}</h1>
<p class="bad" role="alert">${job.errors.length} problem${job.errors.length === 1 ? '' : 's'} in the job folder <code>${job.name}</code>: the draft is shown again once ${job.errors.length === 1 ? 'it is' : 'they are'} put right and saved.</p>
<ol class="errors">${job.errors.map((e) => html`<li><code>${formatError(e)}</code>${sourceLine(job.files, e)}</li>`)}</ol>`, { job: job.name, version: job.version });
}

/** The reading now in force for a field, as it would be typed, with its date. */
function latest(project: Project, key: string, field: string): string | null {
  const m = (project.readings.get(key) as Record<string, { value: unknown; date: string } | undefined> | undefined)?.[field];
  if (!m) return null;
  const v = m.value as Reading | string;
  const shown = typeof v === 'string' ? v : v.kind === 'value' ? String(v.value) : v.kind === 'at-least' ? `>${v.value}` : v.kind;
  return `${shown} (${m.date})`;
}

export interface FormState {
  input: SessionInput;
  result: (SaveResult & { ok: false }) | null;
  fresh: boolean;
}

export function formPage(job: LiveJob, project: Project, state: FormState, nonce: string): string {
  const { input, result } = state;
  const errorIds: { id: string; text: string }[] = [];
  const field = (id: string, name: string, label: string, hint: string, value: string, error: string | undefined, was: string | null, choices?: readonly string[]) => {
    if (error) errorIds.push({ id, text: `${label}: ${error}` });
    const described = [error ? `${id}-err` : '', was ? `${id}-was` : ''].filter(Boolean).join(' ');
    const common = html`id="${id}" name="${name}" ${error ? trusted('aria-invalid="true"') : ''} ${described ? html`aria-describedby="${described}"` : ''}`;
    const control = choices
      ? html`<select ${common}><option value=""></option>${choices.map((c) => html`<option value="${c}"${c === value ? trusted(' selected') : ''}>${c}</option>`)}</select>`
      : html`<input ${common} value="${value}" autocomplete="off" enterkeyhint="next" ${hint === 'text' ? '' : trusted('inputmode="decimal" spellcheck="false"')}>`;
    return html`<div class="field"><label for="${id}">${label} <span class="unit">${hint === 'text' || hint === 'result' ? '' : hint}</span></label>${control}${error ? html`<span class="err" id="${id}-err">${error}</span>` : ''}${was ? html`<span class="was" id="${id}-was">last: ${was}</span>` : ''}</div>`;
  };
  const boards = project.file.boards.map((b) => {
    const circuits = project.circuits.filter((c) => c.board === b.id);
    if (circuits.length === 0) return html``;
    return html`<h2>Board ${b.id}${b.location ? html` <span class="muted">— ${b.location}</span>` : ''}</h2>
${circuits.map((c, i) => {
      const key = circuitKey(c.board, c.ref);
      const typed = input.values.get(key) ?? {};
      const what = [`${c.device} ${c.rating_a} A`, c.ring ? 'ring' : '', c.rcd_ma !== undefined ? `RCD ${c.rcd_ma} mA` : ''].filter(Boolean).join(', ');
      return html`<fieldset><legend>${c.ref} — ${c.description} <span class="muted">(${what})</span></legend><div class="grid">
${fieldsFor(c).map((f) => field(`f-${b.id}-${i}-${f.name}`.replace(/[^A-Za-z0-9_-]/g, '_'), `v|${key}|${f.name}`, f.label, f.hint, typed[f.name] ?? '', result?.cells.get(cellKey(key, f.name)), latest(project, key, f.name), f.choices))}
</div></fieldset>`;
    })}`;
  });
  const sessionFields = html`<div class="session">
${field('s-date', 'date', 'Test date', 'YYYY-MM-DD', input.date, result?.session.get('date'), null)}
${field('s-label', 'label', 'Label (optional)', 'text', input.label, result?.session.get('label'), null)}
${field('s-by', 'tested_by', 'Tested by', 'text', input.testedBy, result?.session.get('tested_by'), null)}
</div>`;
  const form = html`<form id="session" method="post" action="${jobPath(job.name)}record" data-job="${job.name}" data-fresh="${state.fresh ? '1' : '0'}" novalidate>
${sessionFields}${boards}
<div class="actions"><button type="submit">Save session</button><button type="button" class="plain" id="discard">Discard</button><span class="muted hint">Enter: next field · Ctrl+Enter: save</span></div>
</form>`;
  const summary = result && (errorIds.length > 0 || result.job.length > 0)
    ? html`<div role="alert"><p class="bad">Not saved: ${errorIds.length + result.job.length} problem${errorIds.length + result.job.length === 1 ? '' : 's'}.</p>
<ul>${errorIds.map((e) => html`<li><a href="#${e.id}">${e.text}</a></li>`)}${result.job.map((e) => html`<li><code>${formatError(e)}</code></li>`)}</ul></div>`
    : '';
  return page(`${job.name}: record a test session`, nonce, html`<div class="bar"><a href="/">All jobs</a><a href="${jobPath(job.name)}">Draft</a></div>
<h1>Record a test session</h1>
<p><strong>${project.file.title}</strong> <span class="muted">(${job.name})</span>. Type the readings taken; leave a field empty where none was taken. Values take units (<code>0.84</code>, <code>0.84 Ω</code>, <code>&gt;999</code>, <code>n/a</code>, <code>not-tested</code>). The session is saved as a new file in <code>readings/</code>.</p>
<p class="notice" id="restored" hidden>Readings typed earlier in this browser and not yet saved are filled in. <strong>Discard</strong> clears them.</p>
${summary}${form}
<script nonce="${nonce}">${trusted(FORM_SCRIPT)}</script>`);
}

export function messagePage(title: string, message: string, nonce: string): string {
  return page(title, nonce, html`<div class="bar"><a href="/">All jobs</a></div><h1>${title}</h1><p>${message}</p>`);
}
