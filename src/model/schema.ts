// The job's zod schemas: the single source of truth for its types (inferred below).
// Field names, defaults and choices follow CONTRACT.md.
import { z } from 'zod';
import { DEVICE_CODES } from '../reference/device-codes.js';
import { RULE_SET_IDS } from '../reference/rule-sets/index.js';
import { choice, quantity, reading, word, yesNo } from './cells.js';
import type { Quantity } from './units.js';
import { implausible } from './plausible.js';
import { isCalendarDate } from '../load/date.js';
import { plainText } from '../load/number.js';

const implausibleFrequency = (f: number): string | null => implausible('frequency_hz', f, plainText(f));

// ---------------------------------------------------------------- readings/*.csv

/** Measured fields and their quantity: the value is kept in the unit the name says. */
export const MEASURED = {
  r1r2_ohm: 'ohm',
  ring_r1_ohm: 'ohm',
  ring_rn_ohm: 'ohm',
  ring_r2_ohm: 'ohm',
  ir_ll_mohm: 'megohm',
  ir_le_mohm: 'megohm',
  ir_test_v: 'volt',
  zs_ohm: 'ohm',
  rcd_1x_ms: 'millisecond',
  rcd_5x_ms: 'millisecond',
} as const satisfies Record<string, Quantity>;
export type MeasuredField = keyof typeof MEASURED;

export const OUTCOMES = ['ok', 'fail', 'n/a', 'not-tested'] as const;
export type Outcome = (typeof OUTCOMES)[number];

/** The other ways a tester writes n/a and not tested, as a number cell reads them too (units.ts). */
const OUTCOME_ALIASES = { na: 'n/a', 'not tested': 'not-tested', nt: 'not-tested' } as const;
const outcome = (what: string) => choice(OUTCOMES, what, OUTCOME_ALIASES);

/**
 * The schema of a readings row. `units` gives, for a measured field, the unit its column's header
 * names (an instrument export's "Zs (Ω)"): numbers written without a unit are in it.
 */
export function readingRowSchema(units: Partial<Record<MeasuredField, string>> = {}) {
  // keyed by each measured field's unit in a fixed order: the same units give the same key
  // whatever order the headers named them in, and no unit's text can pass for another's
  const key = JSON.stringify(MEASURED_FIELDS.map((f) => units[f] ?? null));
  let schema = rowSchemas.get(key);
  if (!schema) {
    if (rowSchemas.size >= ROW_SCHEMAS_KEPT) rowSchemas.clear();
    schema = rowSchema(units);
    rowSchemas.set(key, schema);
  }
  return schema;
}

const MEASURED_FIELDS = Object.keys(MEASURED) as MeasuredField[];

/**
 * The schemas made, by the units their headers name. A job's sessions mostly name the same units
 * (or none), and a schema is worth keeping: building one, and zod's first parse with it, cost far
 * more than a row. Units come from a header only where they fit the field, so few sets exist; the
 * bound is for a long-running `serve` all the same.
 */
const rowSchemas = new Map<string, ReturnType<typeof rowSchema>>();
const ROW_SCHEMAS_KEPT = 32;

function rowSchema(units: Partial<Record<MeasuredField, string>>) {
  return z.object({
    board: word('the board id'),
    ref: word('the circuit reference'),
    ...(Object.fromEntries(Object.entries(MEASURED).map(([k, q]) => [k, reading(q, units[k as MeasuredField], k).optional()])) as Record<
      MeasuredField,
      z.ZodOptional<ReturnType<typeof reading>>
    >),
    polarity: outcome('the polarity result').optional(),
    rcd_button: outcome('the RCD test-button result').optional(),
    tested_by: z.string().optional(),
    notes: z.string().optional(),
  });
}

export const ReadingRowSchema = readingRowSchema();
export type ReadingRow = z.output<typeof ReadingRowSchema>;
export const READING_COLUMNS = Object.keys(ReadingRowSchema.shape) as (keyof ReadingRow)[];
export type ReadingField = Exclude<keyof ReadingRow, 'board' | 'ref'>;

/** readings: in project.yaml — how an instrument's export maps onto the readings columns. */
export const IGNORE_COLUMN = 'ignore' as const;
export const ReadingsSettingsSchema = z.strictObject({
  /** an instrument's column header (as written, units and all) → a readings column, or "ignore" */
  columns: z.record(z.string(), choice([IGNORE_COLUMN, ...READING_COLUMNS], 'a readings column or "ignore"'))
    .default({}),
});
export type ReadingsSettings = z.output<typeof ReadingsSettingsSchema>;

// ---------------------------------------------------------------- project.yaml

const Party = z.strictObject({
  name: word('a name'),
  address: word('an address').optional(),
  contact: word('a contact').optional(),
});

const isoDate = word('a date as YYYY-MM-DD').refine((s) => isCalendarDate(s), {
  error: (iss) => `found "${String(iss.input)}"; expected a date as YYYY-MM-DD${/^\d{4}-\d{2}-\d{2}$/.test(String(iss.input)) ? ' that is a day of the calendar' : ''}`,
});

export const EARTHING = ['TN-S', 'TN-C-S', 'TT', 'IT'] as const;

export const SupplySchema = z.strictObject({
  // IT is a known word but refused until its rules (IEC 60364-4-41, 411.6) are built: never assessed as TN
  earthing: choice(EARTHING, 'the earthing system').refine((e) => e !== 'IT', {
    error: 'found "IT": IT systems are not assessed (IEC 60364-4-41, 411.6 is not built); packsmith assesses TN-S, TN-C-S and TT',
  }),
  u0_v: quantity('volt', { positive: true, field: 'u0_v' }).default(230),
  phases: choice(['1', '3'] as const, 'the number of phases').transform(Number).default(1),
  frequency_hz: z.number({ error: 'expected the frequency in Hz, e.g. 50' })
    .refine((f) => implausibleFrequency(f) === null, { error: (iss) => implausibleFrequency(iss.input as number) ?? '' }).default(50),
  ze_ohm: quantity('ohm', { field: 'ze_ohm' }).optional(),
  pfc_ka: quantity('kiloampere', { field: 'pfc_ka' }).optional(),
  /** three-phase prospective fault current at the origin, where measured or given (else ≈ 2 × pfc_ka) */
  pfc_3ph_ka: quantity('kiloampere', { field: 'pfc_3ph_ka' }).optional(),
  ra_ohm: quantity('ohm', { field: 'ra_ohm' }).optional(),
  main_switch: word('the main switch, e.g. "100 A 2-pole"').optional(),
});

/** The range of devices a job (or firm) uses, as their maker states: per device code. */
export const DeviceRangeSchema = z.strictObject({
  /** rated breaking capacity (Icn) of the devices of this code that the job uses */
  breaking_ka: quantity('kiloampere', { positive: true }).optional(),
  /** energy limiting class (1, 2 or 3) marked on type B and C circuit-breakers (BS EN 60898-1 Annex ZA) */
  energy_class: choice(['1', '2', '3'] as const, 'an energy limiting class').transform(Number).optional(),
});

export const RulesSchema = z.strictObject({
  set: choice(RULE_SET_IDS, 'a rule set').default('iec-60364'),
  cmin: z.number({ error: 'expected the voltage factor Cmin, e.g. 0.95' }).min(0.5)
    .max(1, { error: 'Cmin above 1.0 is not a minimum voltage factor (IEC 60909-0 Table 1 gives 0.95 for LV); expected at most 1.0' }).optional(),
  measured_zs_factor: z.number({ error: 'expected a factor for measured Zs, e.g. 0.8' }).gt(0).max(1).optional(),
  vd_lighting_percent: z.number().gt(0).max(20).optional(),
  vd_other_percent: z.number().gt(0).max(20).optional(),
  /** superseded by the two limits below; where given it sets both (as before) */
  final_circuit_limit_a: z.number().gt(0).optional(),
  /** final circuits with socket-outlets up to this rating take Table 41.1 (411.3.2.2: 63 A) */
  final_socket_limit_a: z.number().gt(0).optional(),
  /** final circuits supplying only fixed equipment up to this rating take Table 41.1 (411.3.2.2: 32 A) */
  final_fixed_limit_a: z.number().gt(0).optional(),
  /** the range of devices the job uses, by device code: breaking capacity, energy limiting class */
  devices: z.partialRecord(choice(DEVICE_CODES, 'a device code'), DeviceRangeSchema).optional(),
  r1r2_tolerance_percent: z.number({ error: 'expected a percentage, e.g. 25' }).min(0).max(100).optional(),
  r1r2_tolerance_ohm: z.number({ error: 'expected a resistance in ohms, e.g. 0.05' }).min(0).max(1).optional(),
});

// A board id never holds "/": a circuit is named "BOARD/REF" (fed_by, data.json), which must name one circuit only.
export const BoardSchema = z.strictObject({
  id: word('a board id, e.g. DB1').refine((id) => !id.includes('/'), {
    error: (iss) => `found "${String(iss.input)}"; a board id cannot hold "/" (a circuit is named BOARD/REF)`,
  }),
  location: word('where the board is').optional(),
  zdb_ohm: quantity('ohm', { field: 'zdb_ohm' }).optional(),
  pfc_ka: quantity('kiloampere', { field: 'pfc_ka' }).optional(),
  /** three-phase prospective fault current at the board, where measured or given */
  pfc_3ph_ka: quantity('kiloampere', { field: 'pfc_3ph_ka' }).optional(),
  /** the circuit that feeds this board, as BOARD/REF (a sub-main in circuits.csv); absent: fed from the origin */
  fed_by: word('the feeding circuit as BOARD/REF, e.g. DB1/4').optional(),
});

export const PREMISES = ['dwelling', 'other'] as const;

export const PAPER = ['A4', 'Letter'] as const;
export type Paper = (typeof PAPER)[number];

const Signer = z.strictObject({
  name: word('a name'),
  date: isoDate.optional(),
});

export const ProjectFileSchema = z.strictObject({
  title: word('the job title'),
  client: Party,
  site: z.strictObject({ address: word('the site address') }),
  installer: z.strictObject({
    firm: word('the firm'),
    address: word('an address').optional(),
    contact: word('a contact').optional(),
  }),
  dates: z.strictObject({ started: isoDate.optional(), completed: isoDate.optional() }).default({}),
  supply: SupplySchema,
  /** dwelling (default: the stricter rules apply) or other premises */
  premises: choice(PREMISES, 'the kind of premises').default('dwelling'),
  rules: RulesSchema.default({ set: 'iec-60364' }),
  boards: z.array(BoardSchema, { error: 'expected a list of boards' }).min(1, { error: 'list at least one board' })
    .superRefine((boards, ctx) => {
      const first = new Map<string, number>();
      boards.forEach((b, i) => {
        const at = first.get(b.id);
        if (at === undefined) first.set(b.id, i);
        else ctx.addIssue({ code: 'custom', path: [i, 'id'], message: `board "${b.id}" is listed twice (also board ${at + 1} of the list); every board id names one board` });
      });
    }),
  readings: ReadingsSettingsSchema.default({ columns: {} }),
  /** how a spreadsheet's own column headers map onto circuits.csv's columns, or "ignore" */
  circuits: z.lazy(() => CircuitsSettingsSchema).default({ columns: {} }),
  /** a firm's theme folder, relative to the job folder (templates, partials, stylesheet, logo) */
  theme: word('a theme folder, e.g. ../../themes/my-firm').optional(),
  paper: choice(PAPER, 'the paper size').optional(),
  /** the people who sign the pack; a missing one leaves a blank line to write on */
  signoff: z.strictObject({ designer: Signer.optional(), installer: Signer.optional(), inspector: Signer.optional() }).default({}),
});

export type ProjectFile = z.output<typeof ProjectFileSchema>;
export type Supply = ProjectFile['supply'];
export type RuleOverrides = ProjectFile['rules'];
export type Board = ProjectFile['boards'][number];

// ---------------------------------------------------------------- circuits.csv

export const KINDS = ['lighting', 'power', 'heating', 'motor', 'other'] as const;
export const METHODS = ['A1', 'A2', 'B1', 'B2', 'C', 'D', 'E', 'F'] as const;
export const RCD_TYPES = ['AC', 'A', 'F', 'B', 'AC-S', 'A-S', 'F-S', 'B-S'] as const;
export type RcdType = (typeof RCD_TYPES)[number];

export const CircuitSchema = z.object({
  board: word('the board id'),
  ref: word('the circuit reference'),
  description: word('what the circuit supplies'),
  kind: choice(KINDS, 'the kind of circuit'),
  ib_a: quantity('ampere'),
  device: choice(DEVICE_CODES, 'a device code'),
  rating_a: quantity('ampere', { positive: true }),
  live_mm2: quantity('mm2', { positive: true }),
  cpc_mm2: quantity('mm2', { positive: true }),
  length_m: quantity('metre', { positive: true }),
  method: choice(METHODS, 'an installation reference method'),
  phases: choice(['1', '3'] as const, 'the number of phases').transform(Number).default(1),
  breaking_ka: quantity('kiloampere', { positive: true }).optional(),
  rcd_ma: quantity('milliampere', { positive: true, field: 'rcd_ma' }).optional(),
  rcd_type: choice(RCD_TYPES, 'an RCD type').optional(),
  insulation: choice(['pvc70', 'xlpe90'] as const, 'the cable insulation').default('pvc70'),
  conductor: choice(['cu', 'al'] as const, 'the conductor material').default('cu'),
  cpc_in_cable: yesNo('whether the cpc is a core of the cable').default(true),
  // absent: the capacity table's reference, 30 °C air (20 °C ground for method D)
  ambient_c: quantity('celsius').optional(),
  grouped: quantity('count', { min: 1 }).default(1),
  // millimetres, as its name says: "0.6 m" is 600 mm
  insulation_mm: quantity('millimetre').default(0),
  ring: yesNo('whether this is a ring final circuit').default(false),
  disconnect_s: quantity('second', { positive: true }).optional(),
  /** absent: yes for kind power, else no (see calc/circuit-facts.ts) */
  sockets: yesNo('whether the circuit supplies socket-outlets').optional(),
  outdoors: yesNo('whether it supplies equipment used outdoors').default(false),
  concealed: yesNo('whether its cable is concealed less than 50 mm deep without earthed covering or protection').default(false),
  rcd_exemption: z.string().optional(),
  cpc_protected: yesNo('whether the separate cpc is mechanically protected').default(false),
  let_through_a2s: quantity('ampere2second', { positive: true }).optional(),
  device_ia_a: quantity('ampere', { positive: true }).optional(),
  notes: z.string().optional(),
});

export type Circuit = z.output<typeof CircuitSchema>;
export const CIRCUIT_REQUIRED = ['board', 'ref', 'description', 'kind', 'ib_a', 'device', 'rating_a',
  'live_mm2', 'cpc_mm2', 'length_m', 'method'] as const;
export const CIRCUIT_COLUMNS = Object.keys(CircuitSchema.shape);

/** circuits: in project.yaml — a spreadsheet's column headers → circuits.csv columns, or "ignore". */
export const CircuitsSettingsSchema = z.strictObject({
  columns: z.record(z.string(), choice([IGNORE_COLUMN, ...(CIRCUIT_COLUMNS as [string, ...string[]])], 'a circuits.csv column or "ignore"'))
    .default({}),
});
export type CircuitsSettings = z.output<typeof CircuitsSettingsSchema>;
