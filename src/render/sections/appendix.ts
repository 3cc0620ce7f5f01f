// The appendix: per circuit every check, a passing one in one line (its value against its
// limit), any other with its full basis and, where re-tested, its earlier verdicts; and the
// circuit's curve snippet.
import type { Project } from '../../model/validate.js';
import type { Assessment, CheckResult, CircuitAssessment } from '../../calc/types.js';
import { circuitKey } from '../../model/readings.js';
import { checkLabel, plainWords, sentence } from '../labels.js';
import { look, worstStatus } from '../status.js';
import { comparison, historyLine } from '../values.js';
import { circuitSnippet, snippetRequest } from '../snippets.js';
import { anchor, circuitAnchor } from './schedules.js';

/** A check as the appendix shows it: `full` where the reader needs the whole working. */
export function checkLine(k: CheckResult) {
  const full = k.status !== 'pass' && k.status !== 'n/a';
  // a passing check without a pair of numbers gives its finding, the basis before its first colon
  const line = full ? plainWords(k.basis) : (comparison(k) ?? plainWords(k.basis).split(': ')[0]!);
  const history = historyLine(k);
  return { id: k.id, label: checkLabel(k.id), line, full, date: k.date ?? null, history: history === null ? null : plainWords(history), remedy: k.remedy ? sentence(plainWords(k.remedy)) : null, look: look(k.status) };
}

export function appendixBoards(project: Project, assessment: Assessment, byCircuit: Map<string, CircuitAssessment>) {
  return project.file.boards.map((b) => ({
    id: b.id,
    location: b.location ?? null,
    anchor: anchor('appendix', b.id),
    circuits: project.circuits.filter((c) => c.board === b.id).map((c) => {
      const key = circuitKey(c.board, c.ref);
      const a = byCircuit.get(key)!;
      const snippet = snippetRequest(c, a.derived, project.readings.get(key) ?? {}, assessment.rules, a.feeds);
      return {
        ref: c.ref,
        description: c.description,
        anchor: circuitAnchor(c),
        notes: c.notes ? c.notes : null,
        look: look(worstStatus(a.checks.map((k) => k.status))),
        checks: a.checks.filter((k) => k.status !== 'n/a').map(checkLine),
        // the checks that do not apply, in one line: their labels (each says why in check --explain and data.json)
        notApplicable: a.checks.filter((k) => k.status === 'n/a').map((k) => checkLabel(k.id)).join(', ') || null,
        naLook: look('n/a'),
        // no length passes: why (the schedule shows "none")
        noRun: a.derived.max_length_m === null && a.max_length_basis ? plainWords(a.max_length_basis) : null,
        snippetSvg: circuitSnippet(snippet.request),
        snippetCaption: snippet.caption,
      };
    }),
  }));
}
