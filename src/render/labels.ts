// The one table of human labels: every check id and every field a reader may meet (a column of
// circuits.csv or readings/*.csv, a value calc derives, a field of project.yaml) has the words the
// pack, the changes section and `packsmith check` print for it. Ids and file names stay inside.
// Ids agreed for later checks and derived values (CONTRACT.md) are here already, so they render
// in words the day they arrive.
import type { Status } from '../calc/types.js';
import { boundedCache } from './memo.js';

export interface Label {
  /** sentence case, as a column or row heading */
  label: string;
  /** the unit its values are shown in, if any */
  unit?: string;
}

/** Checks, by id. */
export const CHECK_LABELS: Record<string, string> = {
  overload: 'Overload protection',
  'voltage-drop': 'Voltage drop',
  'zs-design': 'Fault loop, design Zs',
  disconnection: 'Disconnection time',
  adiabatic: 'Fault heating of the cpc',
  'breaking-capacity': 'Breaking capacity',
  continuity: 'Continuity, R1+R2',
  ring: 'Ring continuity',
  insulation: 'Insulation resistance',
  polarity: 'Polarity',
  'zs-measured': 'Fault loop, measured Zs',
  rcd: 'RCD operation',
  'rcd-tt': 'RCD and earth electrode (TT)',
  'additional-protection': 'Additional protection, 30 mA',
  'cpc-size': 'Protective conductor size',
  selectivity: 'Selectivity with the feeder',
};

/** What a check's value and limit are, for the one-line form "measured Zs 0.54 Ω ≤ limit 1.09 Ω". */
export const CHECK_QUANTITY: Record<string, { value: string; limit: string }> = {
  overload: { value: 'In', limit: 'limit' },
  'voltage-drop': { value: 'voltage drop', limit: 'limit' },
  'zs-design': { value: 'design Zs', limit: 'max Zs' },
  disconnection: { value: 'opens within', limit: 'required' },
  adiabatic: { value: 'protective conductor', limit: 'minimum' },
  'breaking-capacity': { value: 'fault current', limit: 'breaking capacity' },
  continuity: { value: 'R1+R2', limit: 'limit' },
  ring: { value: 'largest difference', limit: 'tolerance' },
  insulation: { value: 'lowest reading', limit: 'minimum' },
  'zs-measured': { value: 'measured Zs', limit: 'limit' },
  rcd: { value: 'trip time', limit: 'limit' },
  'rcd-tt': { value: 'touch voltage', limit: 'limit' },
  'additional-protection': { value: 'RCD', limit: 'required' },
  'cpc-size': { value: 'protective conductor', limit: 'minimum' },
  selectivity: { value: 'value', limit: 'limit' },
};

/** The checks that judge the tests on site; all others judge the design. */
export const TEST_CHECKS: ReadonlySet<string> = new Set(['continuity', 'ring', 'insulation', 'polarity', 'zs-measured', 'rcd', 'rcd-tt']);

/** Columns of readings/*.csv. */
export const READING_LABELS: Record<string, Label> = {
  r1r2_ohm: { label: 'R1+R2', unit: 'Ω' },
  ring_r1_ohm: { label: 'Ring r1, end to end', unit: 'Ω' },
  ring_rn_ohm: { label: 'Ring rn, end to end', unit: 'Ω' },
  ring_r2_ohm: { label: 'Ring r2, end to end', unit: 'Ω' },
  ir_ll_mohm: { label: 'Insulation L–L', unit: 'MΩ' },
  ir_le_mohm: { label: 'Insulation L–E', unit: 'MΩ' },
  ir_test_v: { label: 'Insulation test voltage', unit: 'V' },
  polarity: { label: 'Polarity' },
  zs_ohm: { label: 'Measured Zs', unit: 'Ω' },
  rcd_1x_ms: { label: 'RCD trip time at IΔn', unit: 'ms' },
  rcd_5x_ms: { label: 'RCD trip time at 5 IΔn', unit: 'ms' },
  rcd_button: { label: 'RCD test button' },
  tested_by: { label: 'Tested by' },
  notes: { label: 'Remarks' },
};

/** Columns of circuits.csv. */
export const CIRCUIT_LABELS: Record<string, Label> = {
  board: { label: 'Board' },
  ref: { label: 'Circuit' },
  description: { label: 'Description' },
  kind: { label: 'Kind of load' },
  ib_a: { label: 'Design current Ib', unit: 'A' },
  device: { label: 'Protective device' },
  rating_a: { label: 'Rated current In', unit: 'A' },
  live_mm2: { label: 'Live conductor size', unit: 'mm²' },
  cpc_mm2: { label: 'Protective conductor size', unit: 'mm²' },
  length_m: { label: 'Length', unit: 'm' },
  method: { label: 'Reference method' },
  phases: { label: 'Phases' },
  breaking_ka: { label: 'Breaking capacity of the device', unit: 'kA' },
  rcd_ma: { label: 'RCD rated residual current IΔn', unit: 'mA' },
  rcd_type: { label: 'RCD type' },
  insulation: { label: 'Cable insulation' },
  conductor: { label: 'Conductor material' },
  cpc_in_cable: { label: 'Protective conductor in the cable' },
  ambient_c: { label: 'Ambient temperature', unit: '°C' },
  grouped: { label: 'Circuits grouped together' },
  insulation_mm: { label: 'Length in thermal insulation', unit: 'mm' },
  ring: { label: 'Ring final circuit' },
  disconnect_s: { label: 'Required disconnection time set for the circuit', unit: 's' },
  notes: { label: 'Notes' },
  sockets: { label: 'Supplies socket-outlets' },
  outdoors: { label: 'Supplies equipment used outdoors' },
  concealed: { label: 'Cable concealed in a wall' },
  rcd_exemption: { label: 'Reason for omitting the 30 mA RCD' },
  cpc_protected: { label: 'Separate protective conductor mechanically protected' },
  let_through_a2s: { label: "Device's let-through energy", unit: 'A²s' },
  device_ia_a: { label: "Maker's operating current within the required time", unit: 'A' },
};

/** Values calc derives for a circuit (CONTRACT.md). */
export const DERIVED_LABELS: Record<string, Label> = {
  iz_a: { label: 'Current-carrying capacity Iz', unit: 'A' },
  max_zs_ohm: { label: 'Max Zs', unit: 'Ω' },
  r1r2_expected_ohm: { label: 'Expected R1+R2 at 20 °C', unit: 'Ω' },
  zs_design_ohm: { label: 'Design Zs', unit: 'Ω' },
  fault_current_a: { label: 'Earth fault current, design', unit: 'A' },
  disconnect_s: { label: 'Disconnection time', unit: 's' },
  required_disconnect_s: { label: 'Required disconnection time', unit: 's' },
  vd_percent: { label: 'Voltage drop', unit: '%' },
  cpc_min_mm2: { label: 'Minimum protective conductor', unit: 'mm²' },
  zdb_ohm: { label: 'Zdb at the board', unit: 'Ω' },
  pfc_ka: { label: 'Prospective fault current at the board', unit: 'kA' },
  vd_origin_percent: { label: 'Voltage drop from the origin', unit: '%' },
  max_length_m: { label: 'Longest run that still meets the checks', unit: 'm' },
  fault_current_max_a: { label: 'Largest fault current at the board', unit: 'A' },
};

/** Fields of project.yaml (and the firm file), by path with list positions left out. */
export const JOB_LABELS: Record<string, Label> = {
  title: { label: 'Title' },
  premises: { label: 'Kind of premises' },
  'client.name': { label: 'Client' },
  'client.address': { label: "Client's address" },
  'site.address': { label: 'Site address' },
  'installer.firm': { label: 'Installer' },
  'installer.address': { label: "Installer's address" },
  'installer.contact': { label: "Installer's contact" },
  'dates.started': { label: 'Work started' },
  'dates.completed': { label: 'Work completed' },
  'supply.earthing': { label: 'Earthing system' },
  'supply.u0_v': { label: 'Nominal voltage to earth U0', unit: 'V' },
  'supply.phases': { label: 'Supply phases' },
  'supply.frequency_hz': { label: 'Frequency', unit: 'Hz' },
  'supply.ze_ohm': { label: 'Ze', unit: 'Ω' },
  'supply.pfc_ka': { label: 'Prospective fault current at the origin', unit: 'kA' },
  'supply.ra_ohm': { label: 'Earth electrode resistance RA', unit: 'Ω' },
  'supply.main_switch': { label: 'Main switch' },
  'rules.set': { label: 'Rule set' },
  'rules.devices': { label: 'Device data given for this job' },
  'rules.cmin': { label: 'Voltage factor Cmin' },
  'rules.measured_zs_factor': { label: 'Factor on max Zs for measured Zs' },
  'rules.vd_lighting_percent': { label: 'Voltage drop limit, lighting', unit: '%' },
  'rules.vd_other_percent': { label: 'Voltage drop limit, other uses', unit: '%' },
  'rules.final_circuit_limit_a': { label: 'Largest final circuit with the final-circuit time', unit: 'A' },
  'rules.final_socket_limit_a': { label: 'Largest socket-outlet final circuit with the final-circuit time', unit: 'A' },
  'rules.final_fixed_limit_a': { label: 'Largest fixed-equipment final circuit with the final-circuit time', unit: 'A' },
  'rules.r1r2_tolerance_percent': { label: 'R1+R2 tolerance', unit: '%' },
  'rules.r1r2_tolerance_ohm': { label: 'R1+R2 tolerance', unit: 'Ω' },
  'boards.id': { label: 'Board' },
  'boards.location': { label: 'Board location' },
  'boards.zdb_ohm': { label: 'Zdb at the board', unit: 'Ω' },
  'boards.pfc_ka': { label: 'Prospective fault current at the board', unit: 'kA' },
  'boards.fed_by': { label: 'Board fed by circuit' },
  'signoff.designer.name': { label: "Designer's name" },
  'signoff.designer.date': { label: "Designer's date" },
  'signoff.installer.name': { label: "Installer's name" },
  'signoff.installer.date': { label: "Installer's date" },
  'signoff.inspector.name': { label: "Inspector's name" },
  'signoff.inspector.date': { label: "Inspector's date" },
  paper: { label: 'Paper size' },
  theme: { label: 'Theme' },
  'notes.md': { label: 'Notes' },
};

const UNIT_SUFFIX: Record<string, string> = { ohm: 'Ω', mohm: 'MΩ', a: 'A', ka: 'kA', v: 'V', ms: 'ms', s: 's', m: 'm', mm: 'mm', mm2: 'mm²', percent: '%', c: '°C', hz: 'Hz', ma: 'mA' };

/** A field nobody gave words yet: its id in words, the unit suffix read as a unit ("foo_bar_ohm" → "Foo bar, Ω"). */
function fallback(id: string): Label {
  const parts = id.split(/[._\-[\]]+/).filter(Boolean);
  const last = parts.at(-1)?.toLowerCase() ?? '';
  const unit = parts.length > 1 ? UNIT_SUFFIX[last] : undefined;
  const words = (unit ? parts.slice(0, -1) : parts).join(' ');
  return { label: sentence(words), ...(unit ? { unit } : {}) };
}

export const checkLabel = (id: string): string => CHECK_LABELS[id] ?? fallback(id).label;

/** A field of a circuit: a reading, a design column or a derived value, in that order. */
export const circuitFieldLabel = (field: string): Label => READING_LABELS[field] ?? CIRCUIT_LABELS[field] ?? DERIVED_LABELS[field] ?? fallback(field);

/** A field of the job by its path, e.g. "boards[1].location" → "Board 2: board location". */
export function jobFieldLabel(path: string): Label {
  const at = /^boards\[(\d+)\]\.(.+)$/.exec(path);
  if (at) {
    const inner = JOB_LABELS[`boards.${at[2]}`] ?? fallback(at[2]!);
    return { ...inner, label: `Board ${Number(at[1]) + 1}: ${lower(inner.label)}` };
  }
  const bare = path.replace(/\[\d+\]/g, '');
  return JOB_LABELS[bare] ?? (bare.startsWith('readings.columns') ? { label: 'Instrument column names' } : fallback(bare));
}

/** "Measured Zs" → "measured Zs" inside a sentence; "RCD type" stays. */
export function lower(label: string): string {
  const first = label.split(/[\s,]/)[0]!;
  return /^[A-Z][a-z]/.test(label) && !TERMS.has(first) ? label.charAt(0).toLowerCase() + label.slice(1) : label;
}
/** Symbols of the trade that keep their capital inside a sentence. */
const TERMS = new Set(['Ze', 'Zdb', 'Zs', 'Ib', 'In', 'Iz', 'Cmin', 'U0']);

/** The label with its unit: "Design current Ib (A)". */
export const withUnit = (l: Label): string => (l.unit ? `${l.label} (${l.unit})` : l.label);

export const STATUS_WORDS: Record<Status, string> = {
  pass: 'pass', fail: 'fail', attention: 'attention', 'not-verified': 'not verified', 'n/a': 'n/a',
};

const INTERNAL_FILES = /\s*\((?:see |from )?REFERENCE\.md\)|\s*REFERENCE\.md/g;
/** The job's own files, named where a reader needs no file name. */
const JOB_FILES: [RegExp, string][] = [
  [/\b(?:set )?in project\.yaml\b/g, 'set for this job'],
  [/\b(?:set )?in circuits\.csv\b/g, 'set for the circuit'],
  [/\bcircuits\.csv gives\b/g, 'the circuit gives'],
  [/\bproject\.yaml\b/g, 'the job'],
  [/\bcircuits\.csv\b/g, 'the circuit list'],
];
const FIELD_ID = /\b(?:(?:supply|rules|boards|client|site|installer|dates|signoff)\.[a-z][a-z0-9_]*|[a-z][a-z0-9]*(?:_[a-z0-9]+)+)\b/g;

/**
 * Text written for engineers (a check's basis) in the reader's words: project-internal file names
 * dropped, field ids replaced by their labels ("breaking_ka not given" → "breaking capacity of
 * the device not given").
 */
export function plainWordsOf(text: string): string {
  // each replacement needs its file's name in the text: skipped where it is not there
  const internal = text.includes('REFERENCE.md') ? text.replace(INTERNAL_FILES, '') : text;
  const named = internal.includes('project.yaml') || internal.includes('circuits.csv')
    ? JOB_FILES.reduce((t, [file, words]) => t.replace(file, words), internal)
    : internal;
  return named.replace(FIELD_ID, (id) => {
    const known = id.includes('.') ? JOB_LABELS[id] : (READING_LABELS[id] ?? CIRCUIT_LABELS[id] ?? DERIVED_LABELS[id]);
    return known ? lower(known.label) : id;
  });
}

/**
 * What every text plainWordsOf can change holds: an underscore (a field id), a known prefix with its
 * dot (a field of project.yaml) or a file name. Most basis lines hold none of them; they are given
 * back as they are, without a pass of each replacement and without a cache lookup keyed by the long
 * text (tests/render/labels.test.ts compares this with plainWordsOf).
 */
const MAY_CHANGE = /_|REFERENCE\.md|project\.yaml|circuits\.csv|(?:supply|rules|boards|client|site|installer|dates|signoff)\./;

/** plainWords of the same basis line is asked for by the summary, the appendix and each render of a served job. */
const plainWordsCache = boundedCache<string>(4096);
export const plainWords = (text: string): string => (MAY_CHANGE.test(text) ? plainWordsCache(text, () => plainWordsOf(text)) : text);

/** A phrase as a sentence of its own: its first letter a capital. */
export const sentence = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);
