// A folder named on the command line that is not there, said plainly (not as file:row:column).
import { existsSync, statSync } from 'node:fs';
import { resolve } from 'node:path';

/** null when `dir` is a folder; otherwise the message to print. */
export function missingFolder(dir: string, what: string): string | null {
  if (existsSync(dir) && statSync(dir).isDirectory()) return null;
  const abs = resolve(dir);
  return existsSync(abs)
    ? `packsmith: "${dir}" is a file, not a ${what}`
    : `packsmith: no ${what} "${dir}" (looked for ${abs}); check the path, or start a job with packsmith new ${dir}`;
}
