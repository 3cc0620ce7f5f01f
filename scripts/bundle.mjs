// `npm run build`, second step: bundle the compiled command line (dist/cli.js, as tsc wrote it)
// into one file and a chunk per command that only some runs need (dist/bundle/), so that a
// command loads a handful of files instead of some three hundred: `check` starts in a fraction of
// the time. Our modules are bundled with the libraries the quick commands load on every run
// (commander, zod, yaml, csv-parse); the libraries of printing, rendering and serving stay as they
// are in node_modules, loaded only by the commands that use them. The files the code reads from
// the package (templates/, schema/, package.json) are found from src/paths.ts, at any depth.
import { readFileSync, rmSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { build } from 'rolldown';

const root = fileURLToPath(new URL('../', import.meta.url));
const entry = `${root}dist/cli.js`;
const MARK = '// packsmith, bundled by scripts/bundle.mjs';

/** The transformer's helpers, from scripts/bundle-helpers/ (their package is not installed). */
const HELPERS = '@oxc-project/runtime/helpers/';
const helpers = {
  name: 'packsmith-helpers',
  resolveId: (id) => (id.startsWith(HELPERS) ? `${root}scripts/bundle-helpers/${id.slice(HELPERS.length)}.mjs` : null),
};

/** The libraries bundled in: the ones every run of `check` loads. */
const BUNDLED = ['commander', 'zod', 'yaml', 'csv-parse'];
const bundled = (id) => BUNDLED.some((name) => id === name || id.startsWith(`${name}/`));

if (readFileSync(entry, 'utf8').includes(MARK)) {
  process.stderr.write('dist/cli.js is already the bundle: compile first (npm run build does both)\n');
  process.exit(1);
}

rmSync(`${root}dist/bundle`, { recursive: true, force: true });
await build({
  input: entry,
  platform: 'node',
  plugins: [helpers],
  // a bare import that is not bundled stays an import, resolved from node_modules as before
  external: (id, importer) => importer !== undefined && !id.startsWith(HELPERS) && !id.startsWith('.') && !id.startsWith('/') && !id.startsWith('\0') && !bundled(id),
  logLevel: 'warn',
  output: {
    dir: `${root}dist`,
    format: 'esm',
    entryFileNames: 'cli.js',
    chunkFileNames: 'bundle/[name]-[hash].js',
    postBanner: (chunk) => (chunk.isEntry ? MARK : ''),
    minify: true,
    sourcemap: false,
  },
});
