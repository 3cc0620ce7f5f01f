// partials/appendix.hbs in TypeScript: every check of every circuit, with its curve. Same bytes
// as the template.
import type { PackView } from '../view.js';
import { e, status, symbol, truthy } from './html.js';

type AppendixCircuit = PackView['appendix'][number]['circuits'][number];

const HEAD = '<section id="appendix" class="appendix">\n'
  + '  <h2>Appendix: the checks of each circuit</h2>\n'
  + '  <p class="lead">Every check of every circuit. A passing check shows its value against the limit it was compared with; any other check shows its full working. The curve is the protective device\'s time-current band, with the fault point and the required disconnection time.</p>\n';

function circuit(c: AppendixCircuit): string {
  let checks = '';
  for (const k of c.checks) {
    checks += `<li class="${truthy(k.full) ? 'full' : 'brief'}"><span class="label">${e(k.label)}</span><span class="mark">${symbol(k.look)}</span>${e(k.line)}`
      + `${truthy(k.remedy) ? `<span class="remedy">${e(k.remedy)}</span>` : ''}${truthy(k.history) ? `<span class="history">${e(k.history)}</span>` : ''}</li>`;
  }
  if (truthy(c.notApplicable)) checks += `<li class="na"><span class="label">Does not apply</span><span class="mark">${symbol(c.naLook)}</span>${e(c.notApplicable)}</li>`;
  return `  <div class="circuit" id="${e(c.anchor)}">\n`
    + `    <h4>Circuit ${e(c.ref)} — ${e(c.description)} <span class="circuit-status">${status(c.look)}</span>${truthy(c.notes) ? ` <span class="sub circuit-notes">${e(c.notes)}</span>` : ''}</h4>\n`
    + '    <div class="circuit-body">\n'
    + '      <figure class="snippet">\n'
    + `        ${truthy(c.snippetSvg) ? c.snippetSvg : '<p class="none">curve not available</p>'}\n`
    + `        <figcaption>${e(c.snippetCaption)}</figcaption>\n`
    + `        ${truthy(c.noRun) ? `<p class="run">Longest run ${e(c.noRun)}</p>` : ''}\n`
    + '      </figure>\n'
    + '      <ul class="checks">\n'
    + `        ${checks}\n`
    + '      </ul>\n'
    + '    </div>\n'
    + '  </div>\n';
}

/** partials/appendix.hbs for the whole view. */
export function appendix(view: Pick<PackView, 'appendix'>): string {
  let out = HEAD;
  for (const b of view.appendix) {
    out += `  <h3 id="${e(b.anchor)}">Board ${e(b.id)}${truthy(b.location) ? ` — ${e(b.location)}` : ''}</h3>\n`;
    for (const c of b.circuits) out += circuit(c);
  }
  return `${out}</section>\n`;
}
