// A theme: a firm's folder laid out like templates/ (pack.hbs, partials/*.hbs, pack.css,
// theme.css, print-header.hbs, print-footer.hbs, logo.svg|png|jpg). Any file it holds replaces the
// built-in file of the same name; every other file falls back to the built-in templates.
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, extname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const BUILTIN_TEMPLATES = fileURLToPath(new URL('../../templates/', import.meta.url));

const LOGO_TYPES: Record<string, string> = { '.svg': 'image/svg+xml', '.png': 'image/png', '.jpg': 'image/jpeg', '.jpeg': 'image/jpeg' };
const LOGO_NAMES = Object.keys(LOGO_TYPES).map((ext) => `logo${ext}`);

export interface TemplateFiles {
  /** the theme folder (absolute), or null for the built-ins alone */
  theme: string | null;
  /** the file that serves a name (e.g. "partials/cover.hbs"): the theme's, else the built-in, else null */
  find(name: string): string | null;
  read(name: string): string;
  /** partial name → file, the theme's partials over the built-in ones */
  partials(): Map<string, string>;
  /** the logo as a data: URL (the pack stays one self-contained file), or null */
  logo(): { src: string; file: string } | null;
}

const isFile = (p: string): boolean => existsSync(p) && statSync(p).isFile();

export function templateFiles(theme: string | null = null): TemplateFiles {
  const themeDir = theme === null ? null : resolve(theme);
  if (themeDir !== null && !(existsSync(themeDir) && statSync(themeDir).isDirectory())) {
    throw new Error(`theme folder "${theme}" not found (looked in ${themeDir})`);
  }
  const layers = themeDir === null ? [BUILTIN_TEMPLATES] : [themeDir, BUILTIN_TEMPLATES];
  const find = (name: string): string | null => {
    for (const dir of layers) {
      const p = join(dir, name);
      if (isFile(p)) return p;
    }
    return null;
  };
  return {
    theme: themeDir,
    find,
    read(name) {
      const p = find(name);
      if (p === null) throw new Error(`template file "${name}" is neither in the theme nor built in`);
      return readFileSync(p, 'utf8');
    },
    partials() {
      const found = new Map<string, string>();
      for (const dir of [...layers].reverse()) {
        const d = join(dir, 'partials');
        if (!existsSync(d)) continue;
        for (const f of readdirSync(d).filter((n) => n.endsWith('.hbs')).sort()) found.set(basename(f, '.hbs'), join(d, f));
      }
      return found;
    },
    logo() {
      // The first layer holding any logo file wins: a theme's logo.png replaces the built-in logo.svg.
      for (const dir of layers) {
        const name = LOGO_NAMES.find((n) => isFile(join(dir, n)));
        if (name) {
          const file = join(dir, name);
          return { src: `data:${LOGO_TYPES[extname(name)]};base64,${readFileSync(file).toString('base64')}`, file };
        }
      }
      return null;
    },
  };
}
