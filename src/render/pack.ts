// Render one pack: the view through templates/pack.hbs, the stylesheet inlined, so the HTML is a
// single self-contained file that opens from file:// and prints without any request.
import type { Project } from '../model/validate.js';
import type { Assessment } from '../calc/types.js';
import { buildView, type RenderOptions } from './view.js';
import { createEngine, type Engine } from './engine.js';

export function renderPack(project: Project, assessment: Assessment, opts: RenderOptions, engine: Engine = createEngine()): string {
  const view = buildView(project, assessment, opts);
  return engine.render('pack.hbs', { ...view, css: engine.asset('pack.css') });
}
