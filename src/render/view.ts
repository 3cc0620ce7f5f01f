// Project + Assessment → the view the templates read. Every field a template uses is present
// (null where the job gives none), so strict templates never meet a missing field.
import type { Project } from '../model/validate.js';
import type { Assessment, CheckResult, Status } from '../calc/types.js';
import { circuitKey, type CircuitReadings } from '../model/readings.js';
import { MEASURED, type MeasuredField } from '../model/schema.js';
import { fmt, symbolOf, type Reading } from '../model/units.js';
import { markdownToHtml } from './markdown.js';

/** Each status has a word and a symbol as well as a colour: nothing is lost in black and white. */
export const STATUS_LOOK: Record<Status, { word: string; symbol: string; css: string }> = {
  pass: { word: 'pass', symbol: '✓', css: 'st-pass' },
  fail: { word: 'fail', symbol: '✗', css: 'st-fail' },
  attention: { word: 'attention', symbol: '!', css: 'st-attention' },
  'not-verified': { word: 'not verified', symbol: '?', css: 'st-open' },
  'n/a': { word: 'n/a', symbol: '–', css: 'st-na' },
};

export interface RenderOptions {
  /** "DRAFT" or "Revision 3" */
  revisionLabel: string;
  draft: boolean;
  /** the date printed on the cover (issue date; for drafts the last test date) */
  date: string;
  /** what changed since the previous revision (the archive computes it); null: nothing to compare */
  changes?: Changes | null;
}

/** Changes since the previous revision, as the archive found them (values already shown with units). */
export interface Changes {
  /** the revision compared with; null in revision 1 */
  since: { revision: number; date: string } | null;
  /** who issued this revision, when and why; null in a draft */
  issued: { by: string; date: string; reason: string | null } | null;
  circuitsAdded: { board: string; ref: string; description: string }[];
  circuitsRemoved: { board: string; ref: string; description: string }[];
  design: { board: string; ref: string; field: string; before: string; after: string }[];
  readings: { board: string; ref: string; field: string; before: string; after: string }[];
  verdicts: { board: string; ref: string; check: string; before: Status; after: Status }[];
  /** project.yaml and notes.md: supply, rules, boards, parties */
  job: { field: string; before: string; after: string }[];
}

const look = (s: Status) => ({ status: s, ...STATUS_LOOK[s] });

/** The symbols of the units check results carry. */
const UNIT_SYMBOL: Record<string, string> = { ohm: 'Ω', Mohm: 'MΩ', ms: 'ms', V: 'V' };

/** A re-tested check in one line: "1.62 Ω on 2026-11-13 (fail), re-tested 0.71 Ω on 2026-11-20 (pass)". */
export function historyLine(k: CheckResult): string | null {
  if (!k.history) return null;
  const unit = k.unit === null ? '' : ` ${UNIT_SYMBOL[k.unit] ?? k.unit}`;
  return k.history.map((h, i) => {
    const value = h.value === null ? '' : `${h.over_range ? '>' : ''}${fmt(h.value)}${unit} `;
    return `${i === 0 ? '' : 're-tested '}${value}on ${h.date} (${STATUS_LOOK[h.status].word})`;
  }).join(', ');
}

export function showReading(field: MeasuredField, r: Reading): string {
  const unit = symbolOf(MEASURED[field]);
  switch (r.kind) {
    case 'value': return `${fmt(r.value)} ${unit}`;
    case 'at-least': return `>${fmt(r.value)} ${unit}`;
    default: return r.kind;
  }
}

function readingRows(readings: CircuitReadings) {
  const rows: { field: string; shown: string; date: string; earlier: string | null }[] = [];
  for (const field of Object.keys(MEASURED) as MeasuredField[]) {
    const m = readings[field];
    if (!m) continue;
    rows.push({
      field,
      shown: showReading(field, m.value),
      date: m.date,
      earlier: m.earlier.length ? m.earlier.map((e) => `${showReading(field, e.value)} on ${e.date}`).join('; ') : null,
    });
  }
  for (const field of ['polarity', 'rcd_button'] as const) {
    const m = readings[field];
    if (m) rows.push({ field, shown: m.value, date: m.date, earlier: m.earlier.length ? m.earlier.map((e) => `${e.value} on ${e.date}`).join('; ') : null });
  }
  return rows;
}

export function overallStatus(a: Pick<Assessment, 'summary'>): Status {
  if (a.summary.fail > 0) return 'fail';
  if (a.summary['not-verified'] > 0) return 'not-verified';
  if (a.summary.attention > 0) return 'attention';
  return 'pass';
}

export function buildView(project: Project, assessment: Assessment, opts: RenderOptions) {
  const f = project.file;
  const openItems: { board: string; ref: string; description: string; check: string; basis: string; look: ReturnType<typeof look> }[] = [];
  const byCircuit = new Map(assessment.circuits.map((c) => [circuitKey(c.board, c.ref), c]));
  const checkView = (k: CheckResult) => ({ id: k.id, basis: k.basis, date: k.date ?? null, history: historyLine(k), look: look(k.status) });

  const boards = f.boards.map((b) => ({
    id: b.id,
    location: b.location ?? null,
    circuits: project.circuits.filter((c) => c.board === b.id).map((c) => {
      const a = byCircuit.get(circuitKey(c.board, c.ref))!;
      for (const k of a.checks) {
        if (k.status === 'fail' || k.status === 'not-verified' || k.status === 'attention') {
          openItems.push({ board: c.board, ref: c.ref, description: c.description, check: k.id, basis: k.basis, look: look(k.status) });
        }
      }
      return {
        ref: c.ref,
        description: c.description,
        device: c.device,
        rating_a: c.rating_a,
        cable: `${c.live_mm2}/${c.cpc_mm2} mm² ${c.conductor === 'cu' ? 'Cu' : 'Al'} ${c.insulation === 'pvc70' ? 'PVC' : 'XLPE'}`,
        method: c.method,
        length_m: c.length_m,
        ib_a: c.ib_a,
        ring: c.ring,
        max_zs_ohm: a.derived.max_zs_ohm,
        required_disconnect_s: a.derived.required_disconnect_s,
        readings: readingRows(project.readings.get(circuitKey(c.board, c.ref)) ?? {}),
        checks: a.checks.map(checkView),
      };
    }),
  }));
  // fails first, then not verified, then attention
  const rank: Record<string, number> = { fail: 0, 'not-verified': 1, attention: 2 };
  openItems.sort((x, y) => rank[x.look.status]! - rank[y.look.status]!);

  return {
    title: f.title,
    job: project.name,
    client: { name: f.client.name, address: f.client.address ?? null },
    site: f.site.address,
    firm: { name: f.installer.firm, address: f.installer.address ?? null, contact: f.installer.contact ?? null },
    dates: { started: f.dates.started ?? null, completed: f.dates.completed ?? null },
    supply: {
      earthing: f.supply.earthing, u0_v: f.supply.u0_v, phases: f.supply.phases,
      ze_ohm: f.supply.ze_ohm ?? null, pfc_ka: f.supply.pfc_ka ?? null, ra_ohm: f.supply.ra_ohm ?? null,
      main_switch: f.supply.main_switch ?? null,
    },
    rules: { ...assessment.rules, overrides: assessment.rules.overrides.length ? assessment.rules.overrides.join(', ') : null },
    revision: opts.revisionLabel,
    draft: opts.draft,
    date: opts.date,
    overall: look(overallStatus(assessment)),
    summary: (Object.keys(STATUS_LOOK) as Status[]).map((s) => ({ count: assessment.summary[s], look: look(s) })),
    openItems,
    boards,
    sessions: project.sessions,
    notesHtml: project.notes ? markdownToHtml(project.notes) : null,
    changes: opts.changes ? changesView(opts.changes) : null,
  };
}

function changesView(c: Changes) {
  const count = c.circuitsAdded.length + c.circuitsRemoved.length + c.design.length + c.readings.length + c.verdicts.length + c.job.length;
  return {
    ...c,
    verdicts: c.verdicts.map((v) => ({ ...v, before: look(v.before), after: look(v.after) })),
    count,
  };
}

export type PackView = ReturnType<typeof buildView>;
