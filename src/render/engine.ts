// The Handlebars engine: pack.hbs with the partials of partials/, the theme's files over the
// built-in ones (theme.ts), and the helpers the templates use.
//
// Templates fail loudly. Handlebars' strict mode makes `{{clent.name}}` an error, but it still
// lets a misspelled field through where it is a helper's argument (`{{#if clent}}`, `{{#each
// bords}}`, `{{num ze}}`, `{{> status look=lok}}`). So the view is also handed to the templates
// behind a guard that throws on any field it does not have: the view model gives every field
// (null where the job has none), so a missing one is always a template's mistake. Either way the
// error names the template file. User text is always escaped (`{{...}}`); the only unescaped
// values are the stylesheet, the sanitised notes and packsmith's own SVG.
import Handlebars from 'handlebars';
import { readFileSync } from 'node:fs';
import { relative } from 'node:path';
import { fmt } from '../model/units.js';
import { BUILTIN_TEMPLATES, templateFiles, type TemplateFiles } from './theme.js';
import { cspInTemplate, withCsp } from './csp.js';
import { NATIVE_FILES, NATIVE_PARTIALS } from './native/index.js';

export { BUILTIN_TEMPLATES };

export class TemplateError extends Error {
  constructor(readonly file: string, message: string) {
    super(`${file}: ${message}`);
    this.name = 'TemplateError';
  }
}

export interface Engine {
  files: TemplateFiles;
  /** the hottest partials rendered by their TypeScript copies (native/), the theme replacing none of them */
  native: boolean;
  render(template: string, view: unknown): string;
  /**
   * A whole page: `render` with the Content-Security-Policy first in its <head> (csp.ts), put into
   * the template once where it can be, else into each page.
   */
  renderPage(template: string, view: unknown): string;
  /** a file of the template folders as text (e.g. pack.css), read once per engine */
  asset(name: string): string;
}

/** Read from a guarded object (or array): the object itself, unguarded. */
const UNGUARDED = Symbol('unguarded');

/** Property names Handlebars and JavaScript probe on any object; not fields of the view. */
const PROBED = new Set(['toHTML', 'toJSON', 'then', 'inspect', 'length']);

/**
 * The view behind a guard: reading a field it does not have throws, naming the field's path. Each
 * object met is wrapped once per render; its path and proxy are kept in Maps dropped with the
 * render (a pack's view holds thousands of objects: WeakMaps would keep the collector busy).
 */
export function guarded<T>(value: T, path = 'view'): T {
  if (value === null || typeof value !== 'object') return value;
  const paths = new Map<object, string>();
  const proxies = new Map<object, object>();
  /** the value read at `key` of `parent`, wrapped where it is an object */
  const wrap = (v: unknown, parent: object, key: string, array: boolean): unknown => {
    if (typeof v !== 'object' || v === null) return v;
    return proxies.get(v) ?? guard(v, array ? `${paths.get(parent)}[${key}]` : `${paths.get(parent)}.${key}`);
  };
  const objectGuard: ProxyHandler<Record<PropertyKey, unknown>> = {
    get(target, key) {
      const v = target[key];
      if (v === undefined && key === UNGUARDED) return target;
      if (v === undefined && typeof key === 'string' && !(key in target) && !PROBED.has(key)) {
        throw new Error(`the template reads "${key}", which ${paths.get(target)} does not have (it has: ${Object.keys(target).join(', ') || 'nothing'})`);
      }
      return typeof key === 'string' ? wrap(v, target, key, false) : v;
    },
  };
  const arrayGuard: ProxyHandler<unknown[]> = {
    get(target, key) {
      if (key === UNGUARDED) return target;
      const v = (target as unknown as Record<PropertyKey, unknown>)[key];
      return typeof key === 'string' ? wrap(v, target, key, true) : v;
    },
  };
  const guard = (v: object, at: string): object => {
    paths.set(v, at);
    const p = Array.isArray(v) ? new Proxy(v, arrayGuard) : new Proxy(v as Record<PropertyKey, unknown>, objectGuard);
    proxies.set(v, p);
    return p;
  };
  return guard(value, path) as T;
}

const where = (file: string): string => {
  const rel = relative(BUILTIN_TEMPLATES, file);
  return rel.startsWith('..') ? file : `templates/${rel}`;
};

/** A compiled template that names its file when it fails. */
function named(fn: Handlebars.TemplateDelegate, file: string): Handlebars.TemplateDelegate {
  return (context, options) => {
    try {
      return fn(context, options);
    } catch (e) {
      if (e instanceof TemplateError) throw e;
      throw new TemplateError(where(file), e instanceof Error ? e.message : String(e));
    }
  };
}

/**
 * A partial rendered by its TypeScript copy when the template would get a part of the guarded
 * view as it is (the built-in pack.hbs gives each its part so); any other context goes to the
 * template. The copy reads the view unguarded: it is typed, and the test keeps it to the template.
 */
function nativePartial(fn: (context: never) => string, template: Handlebars.TemplateDelegate, file: string): Handlebars.TemplateDelegate {
  return (context, options) => {
    const view = context !== null && typeof context === 'object' ? (context as Record<symbol, unknown>)[UNGUARDED] : undefined;
    if (view === undefined) return template(context, options);
    try {
      return fn(view as never);
    } catch (e) {
      throw new TemplateError(where(file), e instanceof Error ? e.message : String(e));
    }
  };
}

export interface EngineOptions {
  theme?: string | null;
  /** false: every partial through its template, even where a TypeScript copy could serve (the tests compare both) */
  native?: boolean;
}

export function createEngine(opts: EngineOptions = {}): Engine {
  const files = templateFiles(opts.theme ?? null);
  const native = (opts.native ?? true) && !NATIVE_FILES.some((name) => files.overrides(name));
  const hb = Handlebars.create();
  const compile = (file: string, source = readFileSync(file, 'utf8')) => {
    try {
      return named(hb.compile(source, { strict: true }), file);
    } catch (e) {
      throw new TemplateError(where(file), e instanceof Error ? e.message : String(e));
    }
  };
  for (const [name, file] of files.partials()) {
    const fn = native ? NATIVE_PARTIALS.get(name) : undefined;
    hb.registerPartial(name, fn ? nativePartial(fn, compile(file), file) : compile(file));
  }
  hb.registerHelper('num', (n: unknown, digits: unknown) =>
    typeof n === 'number' ? fmt(n, typeof digits === 'number' ? digits : 3) : '—');
  hb.registerHelper('eq', (a: unknown, b: unknown) => a === b);
  const fileOf = (template: string): string => {
    const file = files.find(template);
    if (file === null) throw new Error(`template "${template}" is neither in the theme nor built in`);
    return file;
  };
  const compiled = new Map<string, Handlebars.TemplateDelegate>();
  /** page templates: compiled with the policy inside (`withPolicy`), or without it where it could not be put in */
  const pages = new Map<string, { fn: Handlebars.TemplateDelegate; withPolicy: boolean }>();
  const assets = new Map<string, string>();
  return {
    files,
    native,
    render(template, view) {
      let t = compiled.get(template);
      if (!t) {
        t = compile(fileOf(template));
        compiled.set(template, t);
      }
      return t(guarded(view));
    },
    renderPage(template, view) {
      let p = pages.get(template);
      if (!p) {
        const file = fileOf(template);
        const source = cspInTemplate(readFileSync(file, 'utf8'));
        p = { fn: compile(file, source ?? undefined), withPolicy: source !== null };
        pages.set(template, p);
      }
      const html = p.fn(guarded(view));
      return p.withPolicy ? html : withCsp(html);
    },
    asset(name) {
      let text = assets.get(name);
      if (text === undefined) {
        text = files.read(name);
        assets.set(name, text);
      }
      return text;
    },
  };
}

/** One engine per theme folder (null: the built-ins), made on first use. */
export function engineCache(): (theme: string | null) => Engine {
  const engines = new Map<string | null, Engine>();
  return (theme) => {
    let e = engines.get(theme);
    if (!e) {
      e = createEngine({ theme });
      engines.set(theme, e);
    }
    return e;
  };
}
