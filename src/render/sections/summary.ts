// The summary's open items (worst first) and the circuits the safety notes name.
import type { Project } from '../../model/validate.js';
import type { CheckId, CircuitAssessment, Status } from '../../calc/types.js';
import { circuitKey } from '../../model/readings.js';
import { checkLabel, plainWords } from '../labels.js';
import { look, OPEN, SEVERITY, type Look } from '../status.js';
import { historyLine } from '../values.js';
import { circuitAnchor } from './schedules.js';

/** Checks that fail because the device would open more slowly than the rule requires. */
const SLOW: CheckId[] = ['disconnection', 'zs-design', 'zs-measured'];

interface Who { board: string; ref: string; description: string; anchor: string }

type OpenItem = Who & { check: string; label: string; basis: string; full: boolean; history: string | null; look: Look };

export function openItemsAndSafety(project: Project, byCircuit: Map<string, CircuitAssessment>) {
  // fails first, then not verified, then attention (OPEN in the order of SEVERITY); within a status, in schedule order
  const byStatus = new Map<Status, OpenItem[]>(SEVERITY.filter((s) => OPEN.includes(s)).map((s) => [s, []]));
  const slow: Who[] = [];
  const unverified: Who[] = [];
  for (const c of project.circuits) {
    const a = byCircuit.get(circuitKey(c.board, c.ref))!;
    const who = { board: c.board, ref: c.ref, description: c.description, anchor: circuitAnchor(c) };
    let isSlow = false;
    let isUnverified = false;
    for (const k of a.checks) {
      if (k.status === 'fail' && SLOW.includes(k.id)) isSlow = true;
      if (k.status === 'not-verified') isUnverified = true;
      const open = byStatus.get(k.status);
      if (open === undefined) continue;
      const history = historyLine(k);
      // a fail or a missing reading gives its reason here; an item needing attention points to its working in the appendix
      open.push({ board: who.board, ref: who.ref, description: who.description, anchor: who.anchor, check: k.id, label: checkLabel(k.id), basis: plainWords(k.basis), full: k.status !== 'attention', history, look: look(k.status) });
    }
    if (isSlow) slow.push(who);
    if (isUnverified) unverified.push(who);
  }
  const openItems = [...byStatus.values()].flat();
  return { openItems, safety: { slow, unverified } };
}
