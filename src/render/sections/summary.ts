// The summary's open items (worst first) and the circuits the safety notes name.
import type { Project } from '../../model/validate.js';
import type { CheckId, CircuitAssessment } from '../../calc/types.js';
import { circuitKey } from '../../model/readings.js';
import { checkLabel, plainWords } from '../labels.js';
import { look, OPEN, SEVERITY, type Look } from '../status.js';
import { historyLine } from '../values.js';
import { circuitAnchor } from './schedules.js';

/** Checks that fail because the device would open more slowly than the rule requires. */
const SLOW: CheckId[] = ['disconnection', 'zs-design', 'zs-measured'];

interface Who { board: string; ref: string; description: string; anchor: string }

export function openItemsAndSafety(project: Project, byCircuit: Map<string, CircuitAssessment>) {
  const openItems: (Who & { check: string; label: string; basis: string; full: boolean; history: string | null; look: Look })[] = [];
  const slow: Who[] = [];
  const unverified: Who[] = [];
  for (const c of project.circuits) {
    const a = byCircuit.get(circuitKey(c.board, c.ref))!;
    const who = { board: c.board, ref: c.ref, description: c.description, anchor: circuitAnchor(c) };
    for (const k of a.checks) {
      if (!OPEN.includes(k.status)) continue;
      const history = historyLine(k);
      // a fail or a missing reading gives its reason here; an item needing attention points to its working in the appendix
      openItems.push({ board: who.board, ref: who.ref, description: who.description, anchor: who.anchor, check: k.id, label: checkLabel(k.id), basis: plainWords(k.basis), full: k.status !== 'attention', history, look: look(k.status) });
    }
    if (a.checks.some((k) => k.status === 'fail' && SLOW.includes(k.id))) slow.push(who);
    if (a.checks.some((k) => k.status === 'not-verified')) unverified.push(who);
  }
  // fails first, then not verified, then attention; within a status, in schedule order
  openItems.sort((x, y) => SEVERITY.indexOf(x.look.status) - SEVERITY.indexOf(y.look.status));
  return { openItems, safety: { slow, unverified } };
}
