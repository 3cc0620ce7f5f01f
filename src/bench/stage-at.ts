// One cold pass of the HTML stage by the packsmith built at ROOT (this one, or another revision
// checked out and built by bench/against.ts), over the jobs in PROJECTS. It loads ROOT's own
// modules, so the two codes run the same loop and differ only in what they call:
//
//   node dist/bench/stage-at.js ROOT PROJECTS   → {"seconds":…,"jobs":…,"circuits":…} on stdout
//
// The calls are those every revision since the bench began has exported: loadJob, engineCache,
// renderPackFiles, each under dist/ as the compiler writes it.
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';

interface Loaded { ok: boolean; project: { name: string; circuits: unknown[] }; assessment: unknown }
type Render = (project: unknown, assessment: unknown, opts: object, engine: unknown) => { html: string };

const from = (root: string, rel: string) => import(pathToFileURL(join(root, 'dist', rel)).href);

async function main(root: string, projects: string): Promise<void> {
  const { loadJob } = (await from(root, 'job.js')) as { loadJob: (dir: string) => Loaded };
  const { engineCache } = (await from(root, 'render/engine.js')) as { engineCache: () => (theme: null) => unknown };
  const { renderPackFiles } = (await from(root, 'render/pack.js')) as { renderPackFiles: Render };
  const jobs = readdirSync(projects).sort().map((d) => join(projects, d));
  const out = mkdtempSync(join(tmpdir(), 'packsmith-stage-at-'));
  try {
    const engineFor = engineCache();
    let circuits = 0;
    const t0 = performance.now();
    for (const dir of jobs) {
      const job = loadJob(dir);
      if (!job.ok) throw new Error(`${dir} does not validate with the code at ${root}`);
      circuits += job.project.circuits.length;
      const r = renderPackFiles(job.project, job.assessment, { revisionLabel: 'DRAFT', draft: true, date: '2026-01-23' }, engineFor(null));
      writeFileSync(join(out, `${job.project.name}.html`), r.html);
    }
    const seconds = (performance.now() - t0) / 1000;
    process.stdout.write(`${JSON.stringify({ seconds, jobs: jobs.length, circuits })}\n`);
  } finally {
    rmSync(out, { recursive: true, force: true });
  }
}

const [root, projects] = process.argv.slice(2);
if (!root || !projects) {
  process.stderr.write('usage: node dist/bench/stage-at.js ROOT PROJECTS\n');
  process.exitCode = 2;
} else {
  main(root, projects).catch((e: unknown) => {
    process.stderr.write(`stage-at: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 1;
  });
}
