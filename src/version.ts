// packsmith's own version, from package.json (the same file from src/ under vitest and from dist/).
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { PACKAGE, packagePath } from './paths.js';

export const VERSION: string = PACKAGE.version;

let code: string | null = null;

/**
 * The version with a short hash of packsmith's own modules (src/ under vitest, else dist/: the
 * compiled files and the bundle), so a draft built by other code (a fix to a rule without a new
 * version number) is built again.
 */
export function buildId(): string {
  if (code === null) {
    const root = packagePath(import.meta.url.endsWith('.ts') ? 'src' : 'dist');
    const h = createHash('sha256');
    const walk = (dir: string): void => {
      for (const e of readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : 1))) {
        const p = join(dir, e.name);
        if (e.isDirectory()) walk(p);
        else if (/\.(js|ts)$/.test(e.name) && !e.name.endsWith('.d.ts')) h.update(relative(root, p)).update('\0').update(readFileSync(p)).update('\0');
      }
    };
    walk(root);
    code = h.digest('hex').slice(0, 12);
  }
  return `${VERSION}+${code}`;
}
