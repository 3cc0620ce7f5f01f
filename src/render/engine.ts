// The Handlebars engine: templates/pack.hbs with the partials of templates/partials/, and the
// helpers the templates use. Strict mode: a misspelled field is an error, not a blank cell.
import Handlebars from 'handlebars';
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import { basename, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { fmt } from '../model/units.js';

export const BUILTIN_TEMPLATES = fileURLToPath(new URL('../../templates/', import.meta.url));

export interface Engine {
  render(template: string, view: unknown): string;
  /** a file of the template folder as text (e.g. pack.css) */
  asset(name: string): string;
}

export function createEngine(dir: string = BUILTIN_TEMPLATES): Engine {
  const hb = Handlebars.create();
  const partialsDir = join(dir, 'partials');
  if (existsSync(partialsDir)) {
    for (const f of readdirSync(partialsDir).filter((n) => n.endsWith('.hbs')).sort()) {
      hb.registerPartial(basename(f, '.hbs'), readFileSync(join(partialsDir, f), 'utf8'));
    }
  }
  hb.registerHelper('num', (n: unknown, digits: unknown) =>
    typeof n === 'number' ? fmt(n, typeof digits === 'number' ? digits : 3) : '—');
  hb.registerHelper('eq', (a: unknown, b: unknown) => a === b);
  const compiled = new Map<string, Handlebars.TemplateDelegate>();
  return {
    render(template, view) {
      let t = compiled.get(template);
      if (!t) {
        t = hb.compile(readFileSync(join(dir, template), 'utf8'), { strict: true });
        compiled.set(template, t);
      }
      return t(view);
    },
    asset: (name) => readFileSync(join(dir, name), 'utf8'),
  };
}
