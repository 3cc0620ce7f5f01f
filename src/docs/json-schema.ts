// JSON Schema from the job's zod schemas, for editors (project.yaml, packsmith.yaml) and for the
// generated reference (docs/job-folder.md). A cell's unit parsing is opaque to zod's generator;
// each cell says what it takes (CELL_FORMS in model/cells.ts) and is described here from that:
// a value with a unit is a number or a string like "0.84 Ω".
import { z } from 'zod';
import { CELL_FORMS, type CellForm } from '../model/cells.js';
import { QUANTITIES } from '../model/units.js';
import { ProjectFileSchema, CircuitSchema, ReadingRowSchema } from '../model/schema.js';
import { FirmFileSchema } from '../model/firm.js';
import { DESCRIPTIONS } from './descriptions.js';

export type JsonSchema = Record<string, unknown>;

const escape = (s: string): string => s.replace(/[.*+?^${}()|[\]\\/-]/g, '\\$&');
const NUMBER = '[+-]?(?:[0-9]+(?:\\.[0-9]*)?|\\.[0-9]+)(?:[eE][+-]?[0-9]+)?';

/** A number with one of the quantity's units, as a regular expression (JSON Schema `pattern`). */
export function unitPattern(form: { quantity: keyof typeof QUANTITIES }, reading = false): string {
  const units = Object.keys(QUANTITIES[form.quantity].units).map(escape);
  const value = `${reading ? '>?\\s*' : ''}${NUMBER}${units.length ? `\\s*(?:${units.join('|')})?` : ''}`;
  return reading ? `^\\s*(?:${value}|n/a|N/A|not-tested)\\s*$` : `^\\s*${value}\\s*$`;
}

/** The JSON Schema of one cell. */
export function cellSchema(form: CellForm): JsonSchema {
  switch (form.kind) {
    case 'quantity': {
      const number: JsonSchema = { type: 'number' };
      if (form.positive) number.exclusiveMinimum = 0;
      else if (form.min !== undefined) number.minimum = form.min;
      else if (QUANTITIES[form.quantity].nonNegative) number.minimum = 0;
      if (form.max !== undefined) number.maximum = form.max;
      return { anyOf: [number, { type: 'string', pattern: unitPattern(form) }], 'x-packsmith-unit': form.quantity };
    }
    case 'reading':
      return { anyOf: [{ type: 'number' }, { type: 'string', pattern: unitPattern(form, true) }], 'x-packsmith-unit': form.quantity };
    case 'choice': {
      // written case-insensitively; a number in YAML is read as its text (phases: 1)
      const numbers = form.values.filter((v) => /^\d+$/.test(v)).map(Number);
      return { enum: [...form.values, ...numbers] };
    }
    case 'text':
      return { type: ['string', 'number'], minLength: 1 };
  }
}

/** The form of a cell, through a default and a transform after it (yesNo, phases). */
function formOf(zs: z.ZodType): CellForm | undefined {
  let s: z.ZodType = zs instanceof z.ZodDefault ? (zs.unwrap() as z.ZodType) : zs;
  if (!CELL_FORMS.has(s) && s instanceof z.ZodPipe) {
    const out = s._zod.def.out as unknown as z.ZodType;
    s = CELL_FORMS.has(out) ? out : (s.in as z.ZodType);
  }
  return CELL_FORMS.get(s);
}

/** A default as it is written in the file (yes/no for a flag). */
const asWritten = (v: unknown): unknown => (typeof v === 'boolean' ? (v ? 'yes' : 'no') : v);

/** zod's JSON Schema with each cell described by its form and each field by its description. */
export function jsonSchema(schema: z.ZodType, prefix: string): JsonSchema {
  const out = z.toJSONSchema(schema, {
    io: 'input',
    unrepresentable: 'any',
    override: (ctx) => {
      // a cell, or a cell with a default (the default is kept: it is the field's default)
      const zs = ctx.zodSchema as unknown as z.ZodType;
      if (zs instanceof z.ZodObject) {
        // a cell accepts any input before parsing it, so zod cannot tell which fields are required
        const shape = zs.shape as Record<string, z.ZodType>;
        const required = Object.keys(shape).filter((k) => !(shape[k] instanceof z.ZodOptional || shape[k] instanceof z.ZodDefault));
        if (required.length > 0) (ctx.jsonSchema as JsonSchema).required = required;
        return;
      }
      const form = formOf(zs);
      if (!form) return;
      const keep = Object.fromEntries(Object.entries(ctx.jsonSchema).filter(([k]) => ['description', 'title'].includes(k)));
      for (const k of Object.keys(ctx.jsonSchema)) delete (ctx.jsonSchema as JsonSchema)[k];
      Object.assign(ctx.jsonSchema, cellSchema(form), keep);
      if (zs instanceof z.ZodDefault) (ctx.jsonSchema as JsonSchema).default = asWritten(zs._zod.def.defaultValue);
    },
  }) as JsonSchema;
  describe(out, prefix);
  return out;
}

/** Attach DESCRIPTIONS[`prefix.path`] to every property, depth first. */
function describe(node: JsonSchema, path: string): void {
  const text = DESCRIPTIONS[path] ?? DESCRIPTIONS[path.replace(/^firm\./, 'project.')];
  if (text !== undefined) node.description = text;
  const props = node.properties as Record<string, JsonSchema> | undefined;
  for (const [k, v] of Object.entries(props ?? {})) describe(v, `${path}.${k}`);
  const items = node.items as JsonSchema | undefined;
  if (items && typeof items === 'object') describe(items, `${path}[]`);
}

/** Every field path of a JSON Schema (for the reference and for the descriptions test). */
export function fieldPaths(node: JsonSchema, path: string): string[] {
  const props = node.properties as Record<string, JsonSchema> | undefined;
  const items = node.items as JsonSchema | undefined;
  return [
    ...Object.entries(props ?? {}).flatMap(([k, v]) => [`${path}.${k}`, ...fieldPaths(v, `${path}.${k}`)]),
    ...(items && typeof items === 'object' ? fieldPaths(items, `${path}[]`) : []),
  ];
}

export const SCHEMA_BASE = 'https://packsmith.invalid/schema/';

export function projectJsonSchema(): JsonSchema {
  return { ...jsonSchema(ProjectFileSchema, 'project'), $id: `${SCHEMA_BASE}project.schema.json`, title: 'packsmith project.yaml' };
}

export function firmJsonSchema(): JsonSchema {
  return { ...jsonSchema(FirmFileSchema, 'firm'), $id: `${SCHEMA_BASE}firm.schema.json`, title: 'packsmith packsmith.yaml (firm settings)' };
}

export const circuitsJsonSchema = (): JsonSchema => jsonSchema(CircuitSchema, 'circuits');
export const readingsJsonSchema = (): JsonSchema => jsonSchema(ReadingRowSchema, 'readings');
