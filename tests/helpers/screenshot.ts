// Compare a screenshot with a stored one, ignoring anti-aliasing (pixelmatch). With
// UPDATE_SCREENSHOTS=1 the stored one is written anew instead (look at it before committing).
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import pixelmatch from 'pixelmatch';
import { PNG } from 'pngjs';

export interface Difference { differing: number; total: number; sameSize: boolean }

export function difference(a: Buffer, b: Buffer): Difference {
  const x = PNG.sync.read(a);
  const y = PNG.sync.read(b);
  if (x.width !== y.width || x.height !== y.height) return { differing: Infinity, total: x.width * x.height, sameSize: false };
  const differing = pixelmatch(x.data, y.data, null, x.width, x.height, { threshold: 0.1, includeAA: false });
  return { differing, total: x.width * x.height, sameSize: true };
}

/** The stored screenshot's difference from `png`; writes it when asked to, refuses when it is missing. */
export function againstStored(png: Buffer, stored: string): Difference {
  if (process.env.UPDATE_SCREENSHOTS === '1') {
    mkdirSync(dirname(stored), { recursive: true });
    writeFileSync(stored, png);
  } else if (!existsSync(stored)) {
    writeFileSync(`${stored}.new.png`, png);
    throw new Error(`no stored screenshot ${stored}; wrote ${stored}.new.png — look at it, then run with UPDATE_SCREENSHOTS=1`);
  }
  return difference(png, readFileSync(stored));
}
