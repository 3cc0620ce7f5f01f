// The appendix: per circuit every check, a passing one in one line (its value against its
// limit), any other with its full basis and, where re-tested, its earlier verdicts; and the
// circuit's curve snippet.
import type { CircuitRecord, Project } from '../../model/validate.js';
import type { Assessment, CheckResult, CircuitAssessment, Status } from '../../calc/types.js';
import { circuitKey } from '../../model/readings.js';
import { checkLabel, plainWords, sentence } from '../labels.js';
import { look, worstStatus } from '../status.js';
import { comparison, historyLine } from '../values.js';
import { circuitSnippet, snippetRequest } from '../snippets.js';
import { anchor, circuitAnchor } from './schedules.js';

/** The text before its first ": " (all of it where there is none). */
const beforeColon = (text: string): string => {
  const at = text.indexOf(': ');
  return at === -1 ? text : text.slice(0, at);
};

/** A check as the appendix shows it: `full` where the reader needs the whole working. */
export function checkLine(k: CheckResult) {
  const full = k.status !== 'pass' && k.status !== 'n/a';
  // a passing check without a pair of numbers gives its finding, the basis before its first colon
  const line = full ? plainWords(k.basis) : (comparison(k) ?? beforeColon(plainWords(k.basis)));
  const history = historyLine(k);
  return { id: k.id, label: checkLabel(k.id), line, full, date: k.date ?? null, history: history === null ? null : plainWords(history), remedy: k.remedy ? sentence(plainWords(k.remedy)) : null, look: look(k.status) };
}

type CheckView = ReturnType<typeof checkLine>;

export function appendixBoards(
  project: Project, assessment: Assessment, byCircuit: Map<string, CircuitAssessment>, circuitsOn: (board: string) => CircuitRecord[],
) {
  return project.file.boards.map((b) => ({
    id: b.id,
    location: b.location ?? null,
    anchor: anchor('appendix', b.id),
    circuits: circuitsOn(b.id).map((c) => {
      const key = circuitKey(c.board, c.ref);
      const a = byCircuit.get(key)!;
      const snippet = snippetRequest(c, a.derived, project.readings.get(key) ?? {}, assessment.rules, a.feeds);
      const statuses: Status[] = [];
      const checks: CheckView[] = [];
      let notApplicable: string | null = null;
      for (const k of a.checks) {
        statuses.push(k.status);
        if (k.status !== 'n/a') checks.push(checkLine(k));
        else notApplicable = notApplicable === null ? checkLabel(k.id) : `${notApplicable}, ${checkLabel(k.id)}`;
      }
      return {
        ref: c.ref,
        description: c.description,
        anchor: circuitAnchor(c),
        notes: c.notes ? c.notes : null,
        look: look(worstStatus(statuses)),
        checks,
        // the checks that do not apply, in one line: their labels (each says why in check --explain and data.json)
        notApplicable: notApplicable || null,
        naLook: look('n/a'),
        // no length passes: why (the schedule shows "none")
        noRun: a.derived.max_length_m === null && a.max_length_basis ? plainWords(a.max_length_basis) : null,
        snippetSvg: circuitSnippet(snippet.request),
        snippetCaption: snippet.caption,
      };
    }),
  }));
}
