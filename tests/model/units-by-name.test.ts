// Point 6: a field's unit is the one its name says, and a value written in another unit of the same
// quantity is converted to it. Before, insulation_mm read "0.6 m" as 0.6 mm and passed a cable
// buried in insulation for 600 mm (BS 7671 523.9: more than 0.5 m surrounded takes factor 0.5).
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { BoardSchema, CircuitSchema, MEASURED, ReadingRowSchema, SupplySchema } from '../../src/model/schema.js';
import { capacityOf } from '../../src/calc/design/capacity.js';
import { BASE_CIRCUIT } from '../helpers/project.js';

/** The unit a field's name ends in, and a value of 1 in it written in another unit of the quantity. */
const SUFFIX: Record<string, { one: string[]; value?: number }> = {
  mm: { one: ['1 mm', '0.1 cm', '0.001 m'] },
  m: { one: ['1 m', '1000 mm', '100 cm'] },
  mm2: { one: ['1 mm²', '1 mm2'] },
  a: { one: ['1 A', '1000 mA', '0.001 kA'] },
  // a residual current within rcd_ma's plausible range (6 mA and up: IEC 61008-1 preferred values, from memory)
  ma: { one: ['30 mA', '0.03 A'], value: 30 },
  ka: { one: ['1 kA', '1000 A'] },
  s: { one: ['1 s', '1000 ms'] },
  ms: { one: ['1 ms'] },
  // a voltage within every voltage field's plausible range (U0 6–400 V, a test voltage 50–1500 V)
  v: { one: ['250 V', '0.25 kV'], value: 250 },
  ohm: { one: ['1 Ω', '1000 mΩ', '0.001 kΩ'] },
  mohm: { one: ['1 MΩ', '1000 kΩ'] },
  c: { one: ['1 °C'] },
  a2s: { one: ['1 A²s', '0.000001 kA²s'] },
};

function fieldsOf(shape: Record<string, z.ZodType>) {
  return Object.keys(shape).filter((k) => /_(mm|m|mm2|a|ma|ka|s|ms|v|ohm|mohm|c|a2s)$/.test(k));
}

describe('every field reads the unit its name says', () => {
  const circuitFields = fieldsOf(CircuitSchema.shape);
  it('covers the circuit, supply, board and readings fields with a unit in their name', () => {
    expect(circuitFields).toEqual(expect.arrayContaining(['insulation_mm', 'length_m', 'ib_a', 'rating_a', 'live_mm2', 'rcd_ma', 'breaking_ka', 'disconnect_s', 'ambient_c', 'let_through_a2s', 'device_ia_a']));
    expect(Object.keys(MEASURED).every((k) => fieldsOf(ReadingRowSchema.shape).includes(k))).toBe(true);
  });
  it.each(circuitFields)('circuits.csv %s', (field) => {
    const suffix = /_([a-z0-9]+)$/.exec(field)![1]!;
    for (const written of SUFFIX[suffix]!.one) {
      const r = CircuitSchema.safeParse({ ...BASE_CIRCUIT, ref: '1', [field]: written });
      expect(r.success, `${field} = "${written}"`).toBe(true);
      expect((r.data as Record<string, unknown>)[field], `${field} = "${written}"`).toBeCloseTo(SUFFIX[suffix]!.value ?? 1, 9);
    }
  });
  it.each(['u0_v', 'ze_ohm', 'pfc_ka', 'ra_ohm', 'pfc_3ph_ka'])('project.yaml supply.%s', (field) => {
    const suffix = /_([a-z0-9]+)$/.exec(field)![1]!;
    for (const written of SUFFIX[suffix]!.one) {
      const r = SupplySchema.safeParse({ earthing: 'TN-S', [field]: written });
      expect((r.data as Record<string, unknown>)[field], `${field} = "${written}"`).toBeCloseTo(SUFFIX[suffix]!.value ?? 1, 9);
    }
  });
  it.each(['zdb_ohm', 'pfc_ka'])('project.yaml boards[].%s', (field) => {
    const suffix = /_([a-z0-9]+)$/.exec(field)![1]!;
    for (const written of SUFFIX[suffix]!.one) {
      expect((BoardSchema.parse({ id: 'DB1', [field]: written }) as Record<string, unknown>)[field]).toBeCloseTo(SUFFIX[suffix]!.value ?? 1, 9);
    }
  });
  it.each(Object.keys(MEASURED))('readings %s', (field) => {
    const suffix = /_([a-z0-9]+)$/.exec(field)![1]!;
    for (const written of SUFFIX[suffix]!.one) {
      const r = ReadingRowSchema.parse({ board: 'DB1', ref: '1', [field]: written });
      const v = (r as unknown as Record<string, { kind: string; value: number }>)[field]!;
      expect(v.value, `${field} = "${written}"`).toBeCloseTo(SUFFIX[suffix]!.value ?? 1, 9);
    }
  });
  it('insulation_mm "0.6 m" is 600 mm: more than 0.5 m surrounded by insulation, factor 0.5 (BS 7671 523.9)', () => {
    const c = CircuitSchema.parse({ ...BASE_CIRCUIT, ref: '1', insulation_mm: '0.6 m' });
    expect(c.insulation_mm).toBe(600);
    const cap = capacityOf(c);
    expect(cap.ok && cap.capacity.ci).toBe(0.5);
  });
  it('refuses a unit of another quantity rather than guess', () => {
    expect(CircuitSchema.safeParse({ ...BASE_CIRCUIT, ref: '1', insulation_mm: '0.6 A' }).success).toBe(false);
    expect(CircuitSchema.safeParse({ ...BASE_CIRCUIT, ref: '1', length_m: '20 mm2' }).success).toBe(false);
  });
});
