// The bundled command line (dist/cli.js and dist/bundle/, written by scripts/bundle.mjs in
// `npm run build`) says exactly what the compiled modules it was made from say: the same bytes on
// stdout and stderr and the same exit code, run by run. The unbundled side is dist/program.js, the
// module tsc wrote and the bundle starts from, run in a process of its own the same way. The
// bundled side also runs a small job's check without V8's optimising compiler (src/cli.ts,
// src/commands/tuning.ts) and the unbundled side with it, so these comparisons show that too
// changes nothing it prints.
import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { packsmith, ROOT } from '../helpers/cli.js';
import { generateArchive } from '../../src/bench/generate.js';

/** The compiled modules' command line, unbundled. */
function unbundled(args: string[]) {
  const code = "const { runCli } = await import('./dist/program.js'); process.exitCode = await runCli(JSON.parse(process.argv[1]));";
  const r = spawnSync(process.execPath, ['--input-type=module', '-e', code, JSON.stringify(args)], { cwd: ROOT, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const generated = generateArchive(mkdtempSync(join(tmpdir(), 'packsmith-bundle-')), 1, 17, { circuits: [40, 40] }).jobs[0]!;

describe('the bundled command line', () => {
  it('is the bundle (else the comparisons below would compare the compiled modules with themselves)', () => {
    expect(readFileSync(`${ROOT}dist/cli.js`, 'utf8')).toContain('// packsmith, bundled by scripts/bundle.mjs');
  });

  it('imports only packages that are installed (what it does not bundle, it loads from node_modules)', () => {
    const files = [`${ROOT}dist/cli.js`, ...readdirSync(`${ROOT}dist/bundle`).map((f) => `${ROOT}dist/bundle/${f}`)];
    const bare = new Set<string>();
    for (const file of files) {
      // the bundle's own import forms: `from"x"`, `import"x"` and `import("x")`, x a package name
      for (const m of readFileSync(file, 'utf8').matchAll(/(?:\bfrom\s*|\bimport\s*\(?\s*)"((?!\.)(?:@[\w.-]+\/)?[\w.-]+(?:\/[\w./-]+)?)"/g)) {
        if (!m[1]!.startsWith('node:')) bare.add(m[1]!);
      }
    }
    expect(bare.size).toBeGreaterThan(0);
    for (const id of bare) {
      const pkg = id.split('/').slice(0, id.startsWith('@') ? 2 : 1).join('/');
      expect(existsSync(`${ROOT}node_modules/${pkg}/package.json`), `${id} (imported by the bundle) is not installed`).toBe(true);
    }
  });

  it.each([
    [['check', '--json', 'projects/tannery-row-refit']],
    [['check', '--json', 'projects/heronsgate-pottery']],
    [['check', '--json', 'projects/marsh-street-surgery']],
    [['check', '--json', generated]],
    [['check', '--explain', 'projects/tannery-row-refit']],
    [['check', 'tests/fixtures/no-such-job']],
    [['device', 'mcb:B', '32', '--json']],
    [['--version']],
  ])('gives the same output and exit code as the compiled modules: %j', (args: string[]) => {
    const bundled = packsmith(args);
    const compiled = unbundled(args);
    expect(bundled.stderr).toBe(compiled.stderr);
    expect(bundled.stdout).toBe(compiled.stdout);
    expect(bundled.code).toBe(compiled.code);
  });

  it('finds the package\'s own files from its chunks: the JSON Schema `new` names exists from the job folder', () => {
    const job = join(mkdtempSync(join(tmpdir(), 'packsmith-bundle-new-')), 'job');
    const r = packsmith(['new', job]);
    expect(r.code).toBe(0);
    const m = /^# yaml-language-server: \$schema=(.+)$/.exec(readFileSync(join(job, 'project.yaml'), 'utf8').split('\n')[0]!);
    expect(m).not.toBeNull();
    expect(existsSync(join(job, m![1]!))).toBe(true);
  });
});
