// `npm run build`, first step: compile src/**/*.ts to dist/ (JavaScript and source maps) file by
// file with TypeScript's own emitter, without type-checking. The type check is its own step
// (`npm run typecheck`, also run by `npm test`); here the emit alone is wanted, and per file it is
// what `tsc -p tsconfig.build.json` writes (`tsconfig.json` sets `isolatedModules`, so no file
// needs another's types to be emitted), in a second or two instead of some fifteen.
//
//   node scripts/compile.mjs          compile into dist/
//   node scripts/compile.mjs --check  compare with what tsc itself emits (into a temporary folder)
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';

const root = fileURLToPath(new URL('../', import.meta.url));
const src = join(root, 'src');

/** The options of tsconfig.build.json, as tsc reads them. */
function options() {
  const file = join(root, 'tsconfig.build.json');
  const read = ts.readConfigFile(file, ts.sys.readFile);
  if (read.error) throw new Error(ts.flattenDiagnosticMessageText(read.error.messageText, '\n'));
  const parsed = ts.parseJsonConfigFileContent(read.config, ts.sys, root, undefined, file);
  if (parsed.errors.length > 0) throw new Error(parsed.errors.map((e) => ts.flattenDiagnosticMessageText(e.messageText, '\n')).join('\n'));
  return parsed;
}

function* sources(dir) {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) yield* sources(path);
    else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.d.ts')) yield path;
  }
}

/** Every file of src/ compiled into `out`, as tsc would name and write it. */
function compile(out) {
  // The package is "type": "module", so tsc emits every file as an ES module (module NodeNext);
  // a file given alone cannot tell, so it is told: ES2022 is the same emit for an ES module.
  const compilerOptions = { ...options().options, module: ts.ModuleKind.ES2022, moduleResolution: ts.ModuleResolutionKind.Bundler };
  let failed = false;
  for (const file of sources(src)) {
    const rel = relative(src, file).replace(/\.ts$/, '.js');
    const target = join(out, rel);
    const r = ts.transpileModule(readFileSync(file, 'utf8'), { compilerOptions: { ...compilerOptions, outDir: dirname(target), rootDir: dirname(file) }, fileName: file, reportDiagnostics: true });
    for (const d of r.diagnostics ?? []) {
      failed = true;
      process.stderr.write(`${relative(root, file)}: ${ts.flattenDiagnosticMessageText(d.messageText, '\n')}\n`);
    }
    mkdirSync(dirname(target), { recursive: true });
    writeFileSync(target, r.outputText);
    if (r.sourceMapText !== undefined) writeFileSync(`${target}.map`, r.sourceMapText);
  }
  if (failed) process.exit(1);
}

if (process.argv.includes('--check')) {
  // the same files, byte for byte, as tsc's own emit
  const tmp = mkdtempSync(join(tmpdir(), 'packsmith-compile-'));
  try {
    compile(join(tmp, 'ours'));
    execFileSync(process.execPath, [join(root, 'node_modules/typescript/bin/tsc'), '-p', join(root, 'tsconfig.build.json'), '--outDir', join(tmp, 'tsc')], { stdio: 'inherit' });
    execFileSync('diff', ['-r', join(tmp, 'tsc'), join(tmp, 'ours')], { stdio: 'inherit' });
    process.stdout.write('compile.mjs writes what tsc writes\n');
  } finally {
    rmSync(tmp, { recursive: true, force: true });
  }
} else {
  compile(join(root, 'dist'));
}
