// A theme: a firm's folder laid out like templates/ (pack.hbs, partials/*.hbs, pack.css,
// theme.css, print-header.hbs, print-footer.hbs, logo.svg|png|jpg). Any file it holds replaces the
// built-in file of the same name; every other file falls back to the built-in templates.
// Reads stay inside the theme folder: a file that links outside it is refused (load/confine.ts).
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, extname, join, resolve } from 'node:path';
import { confinedFile } from '../load/confine.js';
import { packagePath } from '../paths.js';

export const BUILTIN_TEMPLATES = packagePath('templates/');

const LOGO_TYPES: Record<string, string> = { '.svg': 'image/svg+xml', '.png': 'image/png', '.jpg': 'image/jpeg', '.jpeg': 'image/jpeg' };
const LOGO_NAMES = Object.keys(LOGO_TYPES).map((ext) => `logo${ext}`);

export interface TemplateFiles {
  /** the theme folder (absolute), or null for the built-ins alone */
  theme: string | null;
  /** the file that serves a name (e.g. "partials/cover.hbs"): the theme's, else the built-in, else null */
  find(name: string): string | null;
  read(name: string): string;
  /** whether the theme holds a file of that name (one it may not read counts: its use fails where it is read) */
  overrides(name: string): boolean;
  /** partial name → file, the theme's partials over the built-in ones */
  partials(): Map<string, string>;
  /** the logo as a data: URL (the pack stays one self-contained file), or null */
  logo(): { src: string; file: string } | null;
}

/** The real path of `name` in a template folder, null when it has none; throws when it links outside. */
function fileIn(dir: string, name: string): string | null {
  const f = confinedFile(dir, name, 'the theme folder');
  if (f.kind === 'missing') return null;
  if (f.kind === 'refused') {
    if (f.message.startsWith('a folder')) return null;
    throw new Error(`theme file ${join(dir, name)}: ${f.message}`);
  }
  return f.path;
}

export function templateFiles(theme: string | null = null): TemplateFiles {
  const themeDir = theme === null ? null : resolve(theme);
  if (themeDir !== null && !(existsSync(themeDir) && statSync(themeDir).isDirectory())) {
    throw new Error(`theme folder "${theme}" not found (looked in ${themeDir})`);
  }
  const layers = themeDir === null ? [BUILTIN_TEMPLATES] : [themeDir, BUILTIN_TEMPLATES];
  const find = (name: string): string | null => {
    for (const dir of layers) {
      const p = fileIn(dir, name);
      if (p !== null) return p;
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
    overrides: (name) => themeDir !== null && confinedFile(themeDir, name, 'the theme folder').kind !== 'missing',
    partials() {
      const found = new Map<string, string>();
      for (const dir of [...layers].reverse()) {
        const d = join(dir, 'partials');
        if (!existsSync(d)) continue;
        for (const f of readdirSync(d).filter((n) => n.endsWith('.hbs')).sort()) {
          const p = fileIn(dir, `partials/${f}`);
          if (p !== null) found.set(basename(f, '.hbs'), p);
        }
      }
      return found;
    },
    logo() {
      // The first layer holding any logo file wins: a theme's logo.png replaces the built-in logo.svg.
      for (const dir of layers) {
        const name = LOGO_NAMES.find((n) => fileIn(dir, n) !== null);
        if (name) {
          const file = fileIn(dir, name)!;
          return { src: `data:${LOGO_TYPES[extname(name)]};base64,${readFileSync(file).toString('base64')}`, file };
        }
      }
      return null;
    },
  };
}
