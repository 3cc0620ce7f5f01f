// Project + Assessment → the view the templates read. The one place that shapes data for
// templates: every field a template uses is present (null where the job gives none), so strict
// templates never meet a missing field, and nothing here is computed that calc should compute.
import type { Project } from '../model/validate.js';
import type { Paper } from '../model/schema.js';
import type { Assessment, CheckId, CheckResult, Status } from '../calc/types.js';
import { circuitKey, type CircuitReadings, type Measured } from '../model/readings.js';
import { MEASURED, type MeasuredField } from '../model/schema.js';
import { fmt, symbolOf, type Reading } from '../model/units.js';
import { markdownToHtml } from './markdown.js';
import { circuitSnippet, snippetRequest } from './snippets.js';

/**
 * Each status has a word, a symbol and a shape as well as a colour (pack.css): nothing is lost in
 * black and white or to a colour-blind reader. `shape` names the outline drawn round the symbol (pack.css `.sh-*`).
 */
export const STATUS_LOOK: Record<Status, { word: string; symbol: string; shape: string; css: string }> = {
  pass: { word: 'pass', symbol: '✓', shape: 'circle', css: 'st-pass' },
  fail: { word: 'fail', symbol: '✗', shape: 'square', css: 'st-fail' },
  attention: { word: 'attention', symbol: '!', shape: 'triangle', css: 'st-attention' },
  'not-verified': { word: 'not verified', symbol: '?', shape: 'dashed', css: 'st-open' },
  'n/a': { word: 'n/a', symbol: '–', shape: 'none', css: 'st-na' },
};

/** From worst to best: what a group of checks is, at its worst. */
const SEVERITY: Status[] = ['fail', 'not-verified', 'attention', 'pass', 'n/a'];

export function worstStatus(statuses: Iterable<Status>): Status {
  let worst = SEVERITY.length - 1;
  for (const s of statuses) worst = Math.min(worst, SEVERITY.indexOf(s));
  return SEVERITY[worst]!;
}

export interface RenderOptions {
  /** "DRAFT" or "Revision 3" */
  revisionLabel: string;
  draft: boolean;
  /** the date printed on the cover (issue date; for drafts the last test date) */
  date: string;
  paper?: Paper;
  /** issued although checks failed or are not verified: the cover says so */
  acceptedOpenItems?: boolean;
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

/** What the theme gives the view: its stylesheets and logo. */
export interface ThemeAssets {
  css: string;
  logo: { src: string } | null;
}

/** The values calc derives for each circuit (CONTRACT.md), in the schedule's order. */
export const DERIVED_FIELDS = [
  'iz_a', 'max_zs_ohm', 'zs_design_ohm', 'fault_current_a', 'disconnect_s', 'required_disconnect_s',
  'vd_percent', 'cpc_min_mm2', 'r1r2_expected_ohm',
] as const;

/** Each recorded reading: how the pack names it, and the check that judges it. */
const READING_NAMES: Record<MeasuredField | 'polarity' | 'rcd_button', { label: string; check: CheckId }> = {
  r1r2_ohm: { label: 'R1+R2', check: 'continuity' },
  ring_r1_ohm: { label: 'ring r1 (end to end)', check: 'ring' },
  ring_rn_ohm: { label: 'ring rn (end to end)', check: 'ring' },
  ring_r2_ohm: { label: 'ring r2 (end to end)', check: 'ring' },
  ir_ll_mohm: { label: 'insulation L–L', check: 'insulation' },
  ir_le_mohm: { label: 'insulation L–E', check: 'insulation' },
  ir_test_v: { label: 'insulation test voltage', check: 'insulation' },
  polarity: { label: 'polarity', check: 'polarity' },
  zs_ohm: { label: 'Zs', check: 'zs-measured' },
  rcd_1x_ms: { label: 'RCD trip time at IΔn', check: 'rcd' },
  rcd_5x_ms: { label: 'RCD trip time at 5 IΔn', check: 'rcd' },
  rcd_button: { label: 'RCD test button', check: 'rcd' },
};

const RULE_LABELS: { key: 'cmin' | 'measured_zs_factor' | 'vd_lighting_percent' | 'vd_other_percent' | 'final_socket_limit_a' | 'final_fixed_limit_a'; label: string; unit: string }[] = [
  { key: 'cmin', label: 'Voltage factor Cmin', unit: '' },
  { key: 'measured_zs_factor', label: 'Factor on max Zs for measured Zs', unit: '' },
  { key: 'vd_lighting_percent', label: 'Voltage drop limit, lighting', unit: '%' },
  { key: 'vd_other_percent', label: 'Voltage drop limit, other uses', unit: '%' },
  { key: 'final_socket_limit_a', label: 'Largest socket-outlet final circuit with the final-circuit time', unit: 'A' },
  { key: 'final_fixed_limit_a', label: 'Largest fixed-equipment final circuit with the final-circuit time', unit: 'A' },
];

const look = (s: Status) => ({ status: s, ...STATUS_LOOK[s] });
type Look = ReturnType<typeof look>;

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

/** Who tested on a date: the tester of the session of that date, if written. */
function testerOn(readings: CircuitReadings, date: string): string | null {
  const t = readings.tested_by;
  if (!t) return null;
  if (t.date === date) return t.value;
  return t.earlier.find((e) => e.date === date)?.value ?? null;
}

function readingRows(readings: CircuitReadings, checks: Map<CheckId, CheckResult>) {
  const rows: { label: string; shown: string; date: string; by: string | null; check: string; look: Look | null; earlier: string | null }[] = [];
  const add = <T>(field: keyof typeof READING_NAMES, m: Measured<T>, show: (v: T) => string) => {
    const name = READING_NAMES[field];
    const judged = checks.get(name.check);
    rows.push({
      label: name.label,
      shown: show(m.value),
      date: m.date,
      by: testerOn(readings, m.date),
      check: name.check,
      look: judged ? look(judged.status) : null,
      earlier: m.earlier.length ? m.earlier.map((e) => `${show(e.value)} on ${e.date}`).join('; ') : null,
    });
  };
  for (const field of Object.keys(READING_NAMES) as (keyof typeof READING_NAMES)[]) {
    if (field === 'polarity' || field === 'rcd_button') {
      const m = readings[field];
      if (m) add(field, m, (v) => v);
    } else {
      const m = readings[field];
      if (m) add(field, m, (v) => showReading(field, v));
    }
  }
  return rows;
}

export function overallStatus(a: Pick<Assessment, 'summary'>): Status {
  if (a.summary.fail > 0) return 'fail';
  if (a.summary['not-verified'] > 0) return 'not-verified';
  if (a.summary.attention > 0) return 'attention';
  return 'pass';
}

/** An id usable in a URL fragment and as a PDF destination. */
const anchor = (...parts: string[]): string => parts.map((p) => p.replace(/[^A-Za-z0-9_-]+/g, '-')).join('-');

const OPEN: Status[] = ['fail', 'not-verified', 'attention'];
/** Checks that fail because the device would open more slowly than the rule requires. */
const SLOW: CheckId[] = ['disconnection', 'zs-design', 'zs-measured'];

export function buildView(project: Project, assessment: Assessment, opts: RenderOptions, assets: ThemeAssets = { css: '', logo: null }) {
  const f = project.file;
  const openItems: { board: string; ref: string; description: string; anchor: string; check: string; basis: string; look: Look }[] = [];
  const slow: { board: string; ref: string; description: string; anchor: string }[] = [];
  const unverified: { board: string; ref: string; description: string; anchor: string }[] = [];
  const circuitOverrides: string[] = [];
  const byCircuit = new Map(assessment.circuits.map((c) => [circuitKey(c.board, c.ref), c]));
  const checkView = (k: CheckResult) => ({ id: k.id, basis: k.basis, date: k.date ?? null, history: historyLine(k), look: look(k.status) });

  const boards = f.boards.map((b) => ({
    id: b.id,
    location: b.location ?? null,
    anchor: anchor('board', b.id),
    zdb_ohm: b.zdb_ohm ?? null,
    pfc_ka: b.pfc_ka ?? null,
    circuits: project.circuits.filter((c) => c.board === b.id).map((c) => {
      const key = circuitKey(c.board, c.ref);
      const a = byCircuit.get(key)!;
      const id = anchor('circuit', c.board, c.ref);
      const readings = project.readings.get(key) ?? {};
      for (const k of a.checks) {
        if (OPEN.includes(k.status)) {
          openItems.push({ board: c.board, ref: c.ref, description: c.description, anchor: id, check: k.id, basis: k.basis, look: look(k.status) });
        }
      }
      const who = { board: c.board, ref: c.ref, description: c.description, anchor: id };
      if (a.checks.some((k) => k.status === 'fail' && SLOW.includes(k.id))) slow.push(who);
      if (a.checks.some((k) => k.status === 'not-verified')) unverified.push(who);
      if (c.disconnect_s !== undefined) circuitOverrides.push(`${c.board} ${c.ref}: required disconnection time ${fmt(c.disconnect_s)} s set in circuits.csv`);
      const derived = Object.fromEntries(DERIVED_FIELDS.map((k) => [k, typeof a.derived[k] === 'number' ? a.derived[k] : null])) as Record<(typeof DERIVED_FIELDS)[number], number | null>;
      const snippet = snippetRequest(c, a.derived, readings, assessment.rules);
      return {
        ref: c.ref,
        description: c.description,
        anchor: id,
        kind: c.kind,
        device: c.device,
        rating_a: c.rating_a,
        cable: `${fmt(c.live_mm2)}/${fmt(c.cpc_mm2)} mm² ${c.conductor === 'cu' ? 'Cu' : 'Al'} ${c.insulation === 'pvc70' ? 'PVC' : 'XLPE'}`,
        method: c.method,
        length_m: c.length_m,
        ib_a: c.ib_a,
        ring: c.ring,
        rcd: c.rcd_ma === undefined ? null : `${fmt(c.rcd_ma)} mA${c.rcd_type ? ` type ${c.rcd_type}` : ''}`,
        notes: c.notes ? c.notes : null,
        derived,
        look: look(worstStatus(a.checks.map((k) => k.status))),
        readings: readingRows(readings, new Map(a.checks.map((k) => [k.id, k]))),
        checks: a.checks.map(checkView),
        snippetSvg: circuitSnippet(snippet.request),
        snippetCaption: snippet.caption,
      };
    }),
  }));
  // fails first, then not verified, then attention; within a status, in schedule order
  openItems.sort((x, y) => SEVERITY.indexOf(x.look.status) - SEVERITY.indexOf(y.look.status));

  const { overrides } = assessment.rules;
  const paper = opts.paper ?? 'A4';
  const signer = (role: string, s: { name: string; date?: string | undefined } | undefined) => ({ role, name: s?.name ?? null, date: s?.date ?? null });

  return {
    title: f.title,
    job: project.name,
    client: { name: f.client.name, address: f.client.address ?? null },
    site: f.site.address,
    firm: { name: f.installer.firm, address: f.installer.address ?? null, contact: f.installer.contact ?? null },
    logo: assets.logo,
    css: assets.css,
    dates: { started: f.dates.started ?? null, completed: f.dates.completed ?? null },
    supply: {
      earthing: f.supply.earthing, u0_v: f.supply.u0_v, phases: f.supply.phases, frequency_hz: f.supply.frequency_hz,
      ze_ohm: f.supply.ze_ohm ?? null, pfc_ka: f.supply.pfc_ka ?? null, ra_ohm: f.supply.ra_ohm ?? null,
      main_switch: f.supply.main_switch ?? null,
      tt: f.supply.earthing === 'TT',
    },
    rules: {
      set: assessment.rules.set,
      setName: assessment.rules.set_name,
      setSource: assessment.rules.set_source,
      premises: assessment.rules.premises,
      u0_v: assessment.rules.u0_v,
      params: RULE_LABELS.map((p) => ({
        label: p.label,
        value: assessment.rules[p.key],
        unit: p.unit,
        overridden: overrides.includes(p.key) || (overrides.includes('final_circuit_limit_a') && p.key.startsWith('final_')),
      })),
      circuitOverrides,
      anyOverride: overrides.length > 0 || circuitOverrides.length > 0,
    },
    revision: opts.revisionLabel,
    draft: opts.draft,
    acceptedOpenItems: opts.acceptedOpenItems ?? false,
    date: opts.date,
    paper: { name: paper, css: paper === 'Letter' ? 'letter' : 'A4' },
    overall: look(overallStatus(assessment)),
    summary: (Object.keys(STATUS_LOOK) as Status[]).map((s) => ({ count: assessment.summary[s], look: look(s) })),
    openItems,
    departures: assessment.departures.map((d) => ({ basis: d.basis, circuits: d.circuits.join(', ') })),
    boards,
    sessions: project.sessions,
    notesHtml: project.notes ? markdownToHtml(project.notes, { topLevel: 3 }) : null,
    changes: opts.changes ? changesView(opts.changes) : null,
    safety: { slow, unverified },
    signoff: [signer('Designer', f.signoff.designer), signer('Installer', f.signoff.installer), signer('Inspector', f.signoff.inspector)],
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
