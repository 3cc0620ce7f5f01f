// Current-carrying capacity Iz = It × Ca × Cg × Ci (IEC 60364-5-52 Annex B), with the tabulated
// capacity It by insulation, reference method and loaded conductors, and the factors for ambient
// temperature (Ca), grouping (Cg) and thermal insulation (Ci). Between tabulated steps the factor
// of the next less favourable step is taken (higher temperature, more circuits, longer contact).
// A size, method or condition the tables do not hold is a problem to report, never a guess.
import { CAPACITY_CU, CAPACITY_SIZES_MM2, type Loaded, type Method } from '../../reference/capacity.js';
import {
  AIR_REFERENCE_C, AMBIENT_AIR, AMBIENT_GROUND, GROUND_REFERENCE_C, GROUPING_BUNCHED,
  THERMAL_INSULATION, THERMAL_SURROUNDED, THERMAL_SURROUNDED_FROM_MM,
} from '../../reference/corrections.js';
import type { Insulation, Material } from '../../reference/conductors.js';
import { fmt } from '../../model/units.js';
import type { Circuit } from '../../model/schema.js';

export interface CapacityInput {
  material: Material;
  insulation: Insulation;
  method: Method;
  loaded: Loaded;
  live_mm2: number;
  /** °C; undefined = the table's reference (30 °C air, 20 °C ground for method D) */
  ambient_c?: number;
  grouped: number;
  insulation_mm: number;
}

export interface Capacity {
  it_a: number;
  ca: number;
  cg: number;
  ci: number;
  iz_a: number;
  table: string;
  basis: string;
}

export type CapacityResult = { ok: true; capacity: Capacity } | { ok: false; field: string; message: string };

/** Each table's keys in ascending order, sorted once (the tables are constants). */
const sortedKeys = new WeakMap<Readonly<Record<number, number>>, readonly number[]>();
function keysOf(table: Readonly<Record<number, number>>): readonly number[] {
  let keys = sortedKeys.get(table);
  if (!keys) {
    keys = Object.keys(table).map(Number).sort((a, b) => a - b);
    sortedKeys.set(table, keys);
  }
  return keys;
}

/** The factor of the first tabulated key at or beyond `x` in the direction that is less favourable. */
function stepFactor(table: Readonly<Record<number, number>>, x: number): { key: number; factor: number } | null {
  const key = keysOf(table).find((k) => k >= x);
  return key === undefined ? null : { key, factor: table[key]! };
}

export function capacity(input: CapacityInput): CapacityResult {
  const insulationWord = input.insulation === 'pvc70' ? 'PVC' : 'XLPE';
  if (input.material !== 'cu') {
    return { ok: false, field: 'conductor', message: 'packsmith holds the IEC 60364-5-52 capacity tables for copper only; aluminium conductors cannot be assessed yet' };
  }
  const column = CAPACITY_CU[input.insulation][input.loaded][input.method];
  if (!column) {
    return { ok: false, field: 'method', message: `no capacity table for method ${input.method} with ${insulationWord} cable in packsmith (method F begins at 25 mm² single-core cables); choose the method your table gives` };
  }
  const i = CAPACITY_SIZES_MM2.indexOf(input.live_mm2 as (typeof CAPACITY_SIZES_MM2)[number]);
  if (i < 0) {
    return { ok: false, field: 'live_mm2', message: `found ${input.live_mm2} mm²; the capacity tables held cover ${CAPACITY_SIZES_MM2.join(', ')} mm²` };
  }
  const it = column.values[i]!;

  const ground = input.method === 'D';
  const reference = ground ? GROUND_REFERENCE_C : AIR_REFERENCE_C;
  const ambient = input.ambient_c ?? reference;
  const ambientTable = (ground ? AMBIENT_GROUND : AMBIENT_AIR)[input.insulation];
  const lowest = keysOf(ambientTable)[0]!;
  const step = ambient < lowest ? { key: lowest, factor: ambientTable[lowest]! } : stepFactor(ambientTable, ambient);
  if (!step) {
    return { ok: false, field: 'ambient_c', message: `found ${ambient} °C; the ${ground ? 'ground' : 'air'} temperature table (IEC 60364-5-52 ${ground ? 'B.52.15' : 'B.52.14'}) ends at ${keysOf(ambientTable).at(-1)!} °C for ${insulationWord}` };
  }
  const g = stepFactor(GROUPING_BUNCHED, input.grouped);
  if (!g) {
    return { ok: false, field: 'grouped', message: `found ${input.grouped} circuits; IEC 60364-5-52 Table B.52.17 gives factors up to 20 bunched circuits` };
  }
  let ci = 1;
  let ciWords = '';
  if (input.insulation_mm > 0) {
    const t = input.insulation_mm > THERMAL_SURROUNDED_FROM_MM ? null : stepFactor(THERMAL_INSULATION, input.insulation_mm);
    ci = t ? t.factor : THERMAL_SURROUNDED;
    ciWords = t ? `Ci for ${input.insulation_mm} mm in thermal insulation (BS 7671 Table 52.2)` : 'Ci for more than 0.5 m surrounded by thermal insulation (BS 7671 523.9)';
  }
  const iz = it * step.factor * g.factor * ci;
  const applied = [['Ca', step.factor], ['Cg', g.factor], ['Ci', ci]].filter(([, f]) => f !== 1) as [string, number][];
  const product = applied.length ? ` × ${applied.map(([n, f]) => `${n} ${f}`).join(' × ')} = ${fmt(iz)} A` : ' (no correction)';
  const why = [
    `It from IEC 60364-5-52 Table ${column.table}, method ${input.method}, ${input.loaded} loaded, ${insulationWord}`,
    ...(step.factor !== 1 ? [`Ca for ${ambient} °C (Table ${ground ? 'B.52.15' : 'B.52.14'})`] : []),
    ...(g.factor !== 1 ? [`Cg for ${input.grouped} circuits bunched (Table B.52.17)`] : []),
    ...(ciWords ? [ciWords] : []),
  ];
  const basis = `Iz = It ${fmt(it)} A${product} (${why.join('; ')})`;
  return { ok: true, capacity: { it_a: it, ca: step.factor, cg: g.factor, ci, iz_a: iz, table: column.table, basis } };
}

/** Iz of a circuit as circuits.csv describes it (2 loaded conductors single-phase, 3 three-phase). */
export function capacityOf(c: Circuit): CapacityResult {
  return capacity({
    material: c.conductor, insulation: c.insulation, method: c.method, loaded: c.phases === 3 ? 3 : 2,
    live_mm2: c.live_mm2, ambient_c: c.ambient_c, grouped: c.grouped, insulation_mm: c.insulation_mm,
  });
}
