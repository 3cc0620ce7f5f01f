// The archive's front page: out/index.html, plain static HTML linking every job's packs.
import Handlebars from 'handlebars';

export interface SiteEntry {
  job: string;
  title: string;
  status: string;
  links: { label: string; href: string }[];
}

const page = Handlebars.compile(
  `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>packsmith archive</title>
<style>body{font-family:"DejaVu Sans",sans-serif;max-width:50rem;margin:2rem auto;padding:0 1rem}
table{border-collapse:collapse;width:100%}td,th{border:1px solid #c9d0d6;padding:.3em .5em;text-align:left}</style></head>
<body><h1>Completion packs</h1>
<table><thead><tr><th>Job</th><th>Title</th><th>Status</th><th>Packs</th></tr></thead><tbody>
{{#each entries}}<tr><td>{{job}}</td><td>{{title}}</td><td>{{status}}</td><td>{{#each links}}<a href="{{href}}">{{label}}</a> {{/each}}</td></tr>
{{/each}}</tbody></table></body></html>
`,
  { strict: true },
);

export function renderSite(entries: SiteEntry[]): string {
  return page({ entries: [...entries].sort((a, b) => a.job.localeCompare(b.job)) });
}
