// Render one pack: the view through pack.hbs, the stylesheets (pack.css, then theme.css) and the
// logo inlined, so the HTML is a single self-contained file that opens from file:// and prints
// without any request. The running header and footer of the PDF are templates too.
import type { Project } from '../model/validate.js';
import type { Assessment } from '../calc/types.js';
import { buildView, type RenderOptions, type ThemeAssets } from './view.js';
import { createEngine, type Engine } from './engine.js';
import { inlineCss } from './csp.js';
import { CURVE_CSS } from './snippet.js';

export interface RenderedPack {
  html: string;
  /** Chromium's running header and footer (page X of Y filled in by the printer) */
  header: string;
  footer: string;
}

/** Each engine's stylesheets and logo, read and joined on its first pack (an engine is one theme's files as first read). */
const assetsOf = new WeakMap<Engine, ThemeAssets>();

export function themeAssets(engine: Engine): ThemeAssets {
  let assets = assetsOf.get(engine);
  if (!assets) {
    const logo = engine.files.logo();
    // the curve snippets' stylesheet once for the whole pack (they carry none of their own), before the theme's
    assets = { css: inlineCss(`${engine.asset('pack.css')}\n${CURVE_CSS}\n${engine.asset('theme.css')}`), logo: logo ? { src: logo.src } : null };
    assetsOf.set(engine, assets);
  }
  return assets;
}

export function renderPackFiles(project: Project, assessment: Assessment, opts: RenderOptions, engine: Engine = createEngine()): RenderedPack {
  const view = buildView(project, assessment, opts, themeAssets(engine));
  return {
    html: engine.renderPage('pack.hbs', view),
    header: engine.render('print-header.hbs', view),
    footer: engine.render('print-footer.hbs', view),
  };
}

export function renderPack(project: Project, assessment: Assessment, opts: RenderOptions, engine: Engine = createEngine()): string {
  return engine.renderPage('pack.hbs', buildView(project, assessment, opts, themeAssets(engine)));
}
