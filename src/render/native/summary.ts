// partials/summary.hbs in TypeScript: the open items, worst first, the departures and the count
// of checks by status. Same bytes as the template.
import type { PackView } from '../view.js';
import { e, status, truthy } from './html.js';

type SummaryView = Pick<PackView, 'openItems' | 'attentionLinked' | 'departures' | 'rules' | 'summary'>;

function openItems(view: SummaryView): string {
  if (!truthy(view.openItems.length)) return '  <p>No open items: every check passed or does not apply.</p>\n';
  let out = '  <h3>Open items</h3>\n'
    + `  <p>Every check that failed, needs attention or is not verified, worst first. None of these is a pass.${truthy(view.attentionLinked) ? ' A check that needs attention has its full working under its circuit in the appendix.' : ''}</p>\n`
    + '  <div class="scroll">\n'
    + '  <table class="open">\n'
    + '    <thead><tr><th scope="col">Circuit</th><th scope="col">Check</th><th scope="col">Status</th><th scope="col">Why</th></tr></thead>\n'
    + '    <tbody>\n';
  for (const o of view.openItems) {
    out += `      <tr><td><a href="#${e(o.anchor)}">${e(o.board)} ${e(o.ref)}</a><br><span class="sub">${e(o.description)}</span></td><td>${e(o.label)}</td><td>${status(o.look)}</td>`
      + `<td>${truthy(o.full) ? e(o.basis) : `<a href="#${e(o.anchor)}">working in the appendix</a>`}${truthy(o.history) ? `<div class="history">${e(o.history)}</div>` : ''}</td></tr>\n`;
  }
  return `${out}    </tbody>\n  </table>\n  </div>\n`;
}

/** partials/summary.hbs for the whole view. */
export function summary(view: SummaryView): string {
  let out = `<section id="summary">\n  <h2>Summary</h2>\n${openItems(view)}`;
  if (truthy(view.departures.length)) {
    out += '  <h3>Departures from the rule set</h3>\n'
      + `  <p>Values less strict than ${e(view.rules.setName)}'s own. A check that passes only because of one is marked attention.</p>\n`
      + `  <ul class="departures">${view.departures.map((d) => `<li>${e(d.basis)}; circuits affected: ${e(d.circuits)}</li>`).join('')}</ul>\n`;
  }
  return `${out}  <h3>Checks by status</h3>\n`
    + '  <div class="scroll">\n'
    + '  <table class="counts">\n'
    + `    <thead><tr>${view.summary.map((s) => `<th scope="col">${status(s.look)}</th>`).join('')}</tr></thead>\n`
    + `    <tbody><tr>${view.summary.map((s) => `<td>${e(s.count)}</td>`).join('')}</tr></tbody>\n`
    + '  </table>\n'
    + '  </div>\n'
    + '</section>\n';
}
