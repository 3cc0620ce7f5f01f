// zod building blocks for cells: a CSV cell or YAML value with a unit becomes a typed value,
// and every problem becomes a message in the words of the trade (what was found, what was expected).
import { z } from 'zod';
import { parseCell, QUANTITIES, type Quantity, type Reading } from './units.js';
import { implausible } from './plausible.js';
import { plainText } from '../load/number.js';

/**
 * How each cell is written, for the JSON Schema and the reference generated from these schemas
 * (src/docs): the preprocessing below is opaque to zod's JSON Schema, so each cell says what it takes.
 */
export type CellForm =
  | { kind: 'quantity'; quantity: Quantity; positive?: boolean; min?: number; max?: number }
  | { kind: 'reading'; quantity: Quantity }
  | { kind: 'choice'; values: readonly string[]; what: string }
  | { kind: 'text'; what: string };
export const CELL_FORMS = z.registry<CellForm>();
const described = <S extends z.ZodType>(schema: S, form: CellForm): S => {
  CELL_FORMS.add(schema, form);
  // a refinement (.refine) clones the pipe but keeps its last stage: register that too
  if (schema instanceof z.ZodPipe) CELL_FORMS.add(schema._zod.def.out as z.ZodType, form);
  return schema;
};

const found = (input: unknown): string =>
  input === undefined || input === '' ? 'nothing' : `"${String(input)}"`;

/** YAML gives numbers as numbers; CSV gives text. Both end up as text for the unit parser. */
const asText = (v: unknown): unknown => (typeof v === 'number' ? plainText(v) : v);

const text = (what: string) =>
  z.preprocess(asText, z.string({ error: (iss) => `found ${found(iss.input)}; expected ${what}` }));

/** A design value: a plain number in the field's unit (no n/a, no over-range). */
export function quantity(q: Quantity, opts: { positive?: boolean; min?: number; max?: number; field?: string } = {}) {
  return described(text(QUANTITIES[q].words).transform((s, ctx) => {
    const r = parseCell(s, q);
    if (!r.ok) {
      ctx.addIssue({ code: 'custom', message: r.message });
      return z.NEVER;
    }
    if (r.reading.kind !== 'value') {
      ctx.addIssue({ code: 'custom', message: `found "${s}"; design data needs ${QUANTITIES[q].words} here` });
      return z.NEVER;
    }
    const v = r.reading.value;
    if (opts.positive && v <= 0) {
      ctx.addIssue({ code: 'custom', message: `found "${s}"; expected ${QUANTITIES[q].words} greater than zero` });
    } else if (opts.min !== undefined && v < opts.min) {
      ctx.addIssue({ code: 'custom', message: `found "${s}"; expected at least ${opts.min}` });
    } else if (opts.max !== undefined && v > opts.max) {
      ctx.addIssue({ code: 'custom', message: `found "${s}"; expected at most ${opts.max}` });
    } else {
      const problem = opts.field ? implausible(opts.field, v, s) : null;
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    }
    return v;
  }), { kind: 'quantity', quantity: q, ...opts });
}

/** A test reading: a number, an over-range lower bound, n/a or not-tested; `unit` the column's. */
export function reading(q: Quantity, unit = '', field = '') {
  return described(text(QUANTITIES[q].words).transform((s, ctx): Reading => {
    const r = parseCell(s, q, unit);
    if (!r.ok) {
      ctx.addIssue({ code: 'custom', message: r.message });
      return z.NEVER;
    }
    // an over-range reading's bound is a number the instrument showed: it too must be plausible
    const problem = 'value' in r.reading ? implausible(field, r.reading.value, s) : null;
    if (problem) {
      ctx.addIssue({ code: 'custom', message: problem });
      return z.NEVER;
    }
    return r.reading;
  }), { kind: 'reading', quantity: q });
}

/** One of a fixed set of words, case-insensitive; the message lists the choices. */
export function choice<const T extends readonly [string, ...string[]]>(values: T, what: string, aliases: Readonly<Record<string, T[number]>> = {}) {
  const lookup = new Map<string, T[number]>([...values.map((v): [string, T[number]] => [v.toLowerCase(), v]), ...Object.entries(aliases).map(([a, v]): [string, T[number]] => [a.toLowerCase(), v])]);
  return described(text(what).transform((s, ctx): T[number] => {
    const v = lookup.get(s.trim().toLowerCase());
    if (v === undefined) {
      ctx.addIssue({ code: 'custom', message: `found "${s}"; expected ${what}: ${values.join(', ')}` });
      return z.NEVER;
    }
    return v;
  }), { kind: 'choice', values, what });
}

export const yesNo = (what: string) => choice(['yes', 'no'] as const, what).transform((v) => v === 'yes');

export const word = (what: string) =>
  described(text(what).pipe(z.string().trim().min(1, { error: `found nothing; expected ${what}` })), { kind: 'text', what });
