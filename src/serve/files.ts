// Files served as they are (the archive site and issued revisions): only regular files inside
// their folder, found without following any name outside it — no "..", no hidden working files,
// and no symbolic link whose target lies elsewhere.
import { realpathSync, statSync } from 'node:fs';
import { extname, join, sep } from 'node:path';

export const CONTENT_TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.pdf': 'application/pdf',
  '.json': 'application/json; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.jpg': 'image/jpeg',
  '.jpeg': 'image/jpeg',
  '.txt': 'text/plain; charset=utf-8',
};

export const contentType = (path: string): string => CONTENT_TYPES[extname(path).toLowerCase()] ?? 'application/octet-stream';

function real(path: string): string | null {
  try {
    return realpathSync(path);
  } catch {
    return null;
  }
}

const inside = (root: string, path: string): boolean => path === root || path.startsWith(root.endsWith(sep) ? root : root + sep);

/**
 * The file that `rest` (the URL path below the folder's prefix, still percent-encoded) names in
 * `root`, or null. A folder gives its index.html.
 */
export function fileInside(root: string, rest: string): string | null {
  const base = real(root);
  if (base === null) return null;
  const segments: string[] = [];
  for (const raw of rest.split('/')) {
    let s: string;
    try {
      s = decodeURIComponent(raw);
    } catch {
      return null;
    }
    if (s === '') continue;
    if (s === '.' || s === '..' || s.startsWith('.') || /[\\/\0]/.test(s)) return null;
    segments.push(s);
  }
  let path = real(join(base, ...segments));
  if (path === null || !inside(base, path)) return null;
  try {
    if (statSync(path).isDirectory()) {
      path = real(join(path, 'index.html'));
      if (path === null || !inside(base, path)) return null;
    }
    return statSync(path).isFile() ? path : null;
  } catch {
    return null;
  }
}
