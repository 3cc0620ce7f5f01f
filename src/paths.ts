// Where packsmith's own files are: the package root (the folder of its package.json), found by
// walking up from this module. One place for it, so the same code finds templates/ and schema/
// whether it runs from src/ (the tests), from dist/ as compiled, or bundled into dist/cli.js and
// its chunks (scripts/bundle.mjs), each at another depth below the root.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

function packageRoot(from: string): string {
  for (let dir = from; ; dir = dirname(dir)) {
    const file = join(dir, 'package.json');
    if (existsSync(file) && (JSON.parse(readFileSync(file, 'utf8')) as { name?: string }).name === 'packsmith') return dir;
    if (dirname(dir) === dir) throw new Error(`packsmith's package.json is not in any folder above ${from}`);
  }
}

/** The package root, with a trailing separator. */
export const PACKAGE_ROOT: string = packageRoot(dirname(fileURLToPath(import.meta.url))) + sep;

/** A file or folder of the package, by its path from the root (a folder given with a trailing "/" keeps it). */
export const packagePath = (rel: string): string => join(PACKAGE_ROOT, rel);

/** packsmith's package.json, read once. */
export const PACKAGE: { version: string } = JSON.parse(readFileSync(packagePath('package.json'), 'utf8')) as { version: string };
