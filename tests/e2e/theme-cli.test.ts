// `build --theme` and `--paper` on the command line, and a job's own `theme` in project.yaml.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run, NO_ARCHIVE } from '../helpers/cli.js';

const HTML_ONLY = { PACKSMITH_CHROME: '/nonexistent/chromium' };
const tmp = (p: string) => mkdtempSync(join(tmpdir(), p));
const pack = (out: string, job: string) => readFileSync(join(out, job, 'draft/pack.html'), 'utf8');

describe('packsmith build with themes', () => {
  it("prints a job with the theme its project.yaml names, and --theme over it for the whole build", async () => {
    const own = tmp('packsmith-own-');
    expect((await run(['build', 'projects/marsh-street-surgery', 'projects/tannery-row-refit', '--out', own, ...NO_ARCHIVE], HTML_ONLY)).code).toBe(0);
    expect(pack(own, 'marsh-street-surgery')).toContain('<div class="band">');
    expect(pack(own, 'tannery-row-refit')).not.toContain('<div class="band">');

    const firm = tmp('packsmith-firm-theme-');
    mkdirSync(join(firm, 'partials'));
    writeFileSync(join(firm, 'partials/cover.hbs'), '<section class="cover" id="cover"><h1>{{title}}</h1><p class="firm-cover">{{firm.name}}</p></section>');
    const forced = tmp('packsmith-forced-');
    expect((await run(['build', 'projects/marsh-street-surgery', 'projects/tannery-row-refit', '--out', forced, '--theme', firm, ...NO_ARCHIVE], HTML_ONLY)).code).toBe(0);
    for (const job of ['marsh-street-surgery', 'tannery-row-refit']) {
      expect(pack(forced, job)).toContain('<p class="firm-cover">');
      expect(pack(forced, job)).not.toContain('<div class="band">');
    }
  });

  it('stops the build on a misspelled field in a theme, naming the file', async () => {
    const firm = tmp('packsmith-typo-theme-');
    mkdirSync(join(firm, 'partials'));
    writeFileSync(join(firm, 'partials/supply.hbs'), '<section id="supply">{{#if supply.earthng}}x{{/if}}</section>');
    const r = await run(['build', 'projects/tannery-row-refit', '--out', tmp('packsmith-x-'), '--theme', firm, ...NO_ARCHIVE], HTML_ONLY);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^packsmith: .*partials\/supply\.hbs: the template reads "earthng", which view\.supply does not have/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it('refuses a missing --theme folder and an unknown --paper plainly', async () => {
    const missing = await run(['build', 'projects/tannery-row-refit', '--out', tmp('packsmith-x-'), '--theme', 'no/such/theme', ...NO_ARCHIVE], HTML_ONLY);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/^packsmith: --theme "no\/such\/theme": no such folder/);
    const paper = await run(['build', 'projects/tannery-row-refit', '--out', tmp('packsmith-x-'), '--paper', 'A5', ...NO_ARCHIVE], HTML_ONLY);
    expect(paper.code).toBe(2);
    expect(paper.stderr).toMatch(/--paper "A5": expected A4 or Letter/);
  });

  it('reports a theme in project.yaml that is not there as file:row:column', async () => {
    const job = tmp('packsmith-job-');
    writeFileSync(join(job, 'project.yaml'), readFileSync('projects/marsh-street-surgery/project.yaml', 'utf8').replace('theme: ../../themes/fenwick-lane', 'theme: ../fenwick-typo'));
    writeFileSync(join(job, 'circuits.csv'), readFileSync('projects/marsh-street-surgery/circuits.csv', 'utf8'));
    const r = await run(['check', job]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^project\.yaml:29:8: theme: no folder "\.\.\/fenwick-typo"/m);
  });
});
