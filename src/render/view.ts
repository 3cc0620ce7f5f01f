// Project + Assessment → the view the templates read. The one place that shapes data for
// templates: every field a template uses is present (null where the job gives none), so strict
// templates never meet a missing field, and nothing here is computed that calc should compute.
// Each section of the pack has its module under sections/; this file puts them together.
import type { Project } from '../model/validate.js';
import type { Paper } from '../model/schema.js';
import type { Assessment, Status } from '../calc/types.js';
import { circuitKey } from '../model/readings.js';
import { markdownToHtml } from './markdown.js';
import { look, overallStatus, STATUS_LOOK } from './status.js';
import { boardSchedules, circuitsByBoard, RESULT_COLUMNS } from './sections/schedules.js';
import { appendixBoards } from './sections/appendix.js';
import { openItemsAndSafety } from './sections/summary.js';
import { rulesView } from './sections/rules.js';
import { changesView, type Changes } from './sections/changes.js';
import { signoffView } from './sections/signoff.js';
import { plainWords, READING_LABELS } from './labels.js';

export { STATUS_LOOK, worstStatus, overallStatus, SEVERITY } from './status.js';
export { historyLine, showReading } from './values.js';
export { DERIVED_FIELDS } from './sections/schedules.js';
export type { Changes } from './sections/changes.js';

export interface RenderOptions {
  /** "DRAFT" or "Revision 3" */
  revisionLabel: string;
  draft: boolean;
  /** the date printed on the cover (issue date; for drafts the last test date) */
  date: string;
  paper?: Paper;
  /** issued although checks failed or are not verified: the cover says so */
  acceptedOpenItems?: boolean;
  /** fingerprint of the firm key that signs this revision; null: unsigned (and every draft) */
  keyFingerprint?: string | null;
  /** what changed since the previous revision (the archive computes it); null: nothing to compare */
  changes?: Changes | null;
  /** the fingerprint of the key that signs this revision (the sign-off prints it); null or absent: unsigned */
  signingKeyFingerprint?: string | null;
}

/** What the theme gives the view: its stylesheets and logo. */
export interface ThemeAssets {
  css: string;
  logo: { src: string } | null;
}

/** The results schedule's column heads, grouped as the table shows them. */
const resultHeads = () => RESULT_COLUMNS.map((c) => ({ head: c.head, title: READING_LABELS[c.field]!.label }));

export function buildView(project: Project, assessment: Assessment, opts: RenderOptions, assets: ThemeAssets = { css: '', logo: null }) {
  const f = project.file;
  const byCircuit = new Map(assessment.circuits.map((c) => [circuitKey(c.board, c.ref), c]));
  // each board's circuits, grouped once for the schedules and the appendix
  const circuitsOn = circuitsByBoard(project);
  const { openItems, safety } = openItemsAndSafety(project, byCircuit);
  const paper = opts.paper ?? 'A4';

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
    rules: rulesView(project, assessment),
    revision: opts.revisionLabel,
    draft: opts.draft,
    acceptedOpenItems: opts.acceptedOpenItems ?? false,
    date: opts.date,
    paper: { name: paper, css: paper === 'Letter' ? 'letter' : 'A4' },
    overall: look(overallStatus(assessment)),
    summary: (Object.keys(STATUS_LOOK) as Status[]).map((s) => ({ count: assessment.summary[s], look: look(s) })),
    openItems,
    // the summary says where the working of an item needing attention is, when there is one
    attentionLinked: openItems.some((o) => !o.full),
    departures: assessment.departures.map((d) => ({ basis: plainWords(d.basis), circuits: d.circuits.join(', ') })),
    boards: boardSchedules(project, byCircuit, assessment, circuitsOn),
    resultHeads: resultHeads(),
    appendix: appendixBoards(project, assessment, byCircuit, circuitsOn),
    sessions: project.sessions,
    notesHtml: project.notes ? markdownToHtml(project.notes, { topLevel: 3 }) : null,
    changes: opts.changes ? changesView(opts.changes) : null,
    safety,
    signoff: signoffView(project, { issued: opts.changes?.issued ?? null, draft: opts.draft, signingKeyFingerprint: opts.signingKeyFingerprint ?? opts.keyFingerprint ?? null }),
  };
}

export type PackView = ReturnType<typeof buildView>;
