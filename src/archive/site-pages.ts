// What each page of the archive site was rendered from, so a build renders again only the pages
// whose input changed (after one re-test in a 1,000-job archive: that job's page, and the index
// where its row changed). Kept in the output folder as a dot-file the site ignores: for each page,
// a hash of its input (the page's data) and the page's size and modification time as written, all
// under packsmith's build id. A page is taken as current only when its input hash, size and time
// all match (and it is a plain file); a record that is missing, unreadable or of other code means
// every page is rendered (and written only where it differs), as without one. A page taken as
// current is not written, so nothing is written through a folder that is not packsmith's.
import { lstatSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { sha256 } from './hash.js';
import { writeReplacing } from './files.js';
import { parseJson } from './json.js';
import { buildId } from '../version.js';

export const SITE_PAGES_FILE = '.site-pages.json';
const FORMAT = 'packsmith-site-pages/1';

/** The record's pages (page path with / → [input hash, size, mtime in ms]), or null where it cannot be used. */
function readRecord(path: string, renderer: string): Record<string, unknown> | null {
  try {
    const parsed = parseJson(readFileSync(path, 'utf8'));
    const v = parsed.ok ? (parsed.value as { format?: unknown; renderer?: unknown; pages?: unknown } | null) : null;
    if (v && typeof v === 'object' && v.format === FORMAT && v.renderer === renderer && v.pages && typeof v.pages === 'object' && !Array.isArray(v.pages)) {
      return v.pages as Record<string, unknown>;
    }
  } catch {
    /* missing or unreadable: every page is rendered */
  }
  return null;
}

/** A page's size and time, where it is a plain file (not a link). */
function pageStat(out: string, segments: string[]): [number, number] | null {
  try {
    const st = lstatSync(join(out, ...segments));
    return st.isFile() ? [st.size, st.mtimeMs] : null;
  } catch {
    return null;
  }
}

const plain = (s: string): boolean => s !== '' && s !== '.' && s !== '..' && !/[\\/]/.test(s);

export interface SitePages {
  /** Whether the page at `segments` (inside the output folder) was written from this `input` and is as written. */
  current(segments: string[], input: unknown): boolean;
  /** The page at `segments` was just written from the `input` last asked about. */
  wrote(segments: string[]): void;
  /** Keep the record (nothing is written when nothing changed). */
  save(): void;
}

export function sitePages(out: string): SitePages {
  const path = join(out, SITE_PAGES_FILE);
  const renderer = buildId();
  const old = readRecord(path, renderer);
  const pages: Record<string, [string, number, number]> = {};
  const asked = new Map<string, string>();
  let changed = old === null;
  return {
    current(segments, input) {
      const key = segments.join('/');
      const hash = sha256(JSON.stringify(input));
      asked.set(key, hash);
      const had = old && Object.hasOwn(old, key) ? old[key] : undefined;
      if (!Array.isArray(had) || had.length !== 3 || had[0] !== hash || !segments.every(plain)) return false;
      const st = pageStat(out, segments);
      if (!st || st[0] !== had[1] || st[1] !== had[2]) return false;
      pages[key] = [hash, st[0], st[1]];
      return true;
    },
    wrote(segments) {
      const key = segments.join('/');
      const hash = asked.get(key);
      const st = pageStat(out, segments);
      if (hash !== undefined && st) pages[key] = [hash, st[0], st[1]];
      changed = true;
    },
    save() {
      if (!changed && Object.keys(old ?? {}).every((p) => Object.hasOwn(pages, p))) return;
      writeReplacing(path, `${JSON.stringify({ format: FORMAT, renderer, pages })}\n`);
    },
  };
}
