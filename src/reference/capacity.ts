// Source: IEC 60364-5-52:2009 Annex B — current-carrying capacities (A) of copper conductors,
// 30 °C ambient air (20 °C ground for method D), by insulation, loaded conductors and reference
// method: Tables B.52.2 (PVC, 2 loaded), B.52.3 (XLPE, 2 loaded), B.52.4 (PVC, 3 loaded),
// B.52.5 (XLPE, 3 loaded), B.52.10 (PVC, method E), B.52.11 (XLPE, method E).
// Every value carries where it was read (SOURCES below): packsmith's REFERENCE.md ("ref"), a public
// reproduction of the IEC tables ("iec-repro"), ABNT NBR 5410:2004 Tables 36–39 ("nbr-5410"), or
// brought from the standard without the document at hand ("from memory").
// Method D is the 2001 edition's single buried method (in ducts in the ground, 2.5 K·m/W); the
// 2009 edition splits it into D1/D2, so its column is read from NBR 5410, which keeps the single D.
// Method F (single-core cables touching) begins at 25 mm² in the standard and is not held here.

export type Method = 'A1' | 'A2' | 'B1' | 'B2' | 'C' | 'D' | 'E' | 'F';
export type Loaded = 2 | 3;

/** conductor sizes of every column below, mm² */
export const CAPACITY_SIZES_MM2 = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240] as const;

export const SOURCES = {
  ref: 'packsmith REFERENCE.md (IEC 60364-5-52 Annex B, read from public reproductions)',
  'iec-repro': 'IEC 60364-5-52:2009 Tables B.52.2–B.52.5, B.52.10–B.52.13 as reproduced in public cable-sizing data (sizes 1.5–300 mm²), checked against a second reproduction citing the same tables',
  'nbr-5410': 'ABNT NBR 5410:2004 Tables 36–39, the Brazilian adoption of the IEC 60364-5-52 capacities, which also tabulates 0.5–1 mm² and the single buried method D (public reproductions)',
  'from memory': 'from memory: brought from IEC 60364-5-52 without the document at hand',
} as const;
export type Provenance = keyof typeof SOURCES;

export interface CapacityColumn {
  table: string;
  /** one per CAPACITY_SIZES_MM2 */
  values: readonly number[];
  /** where each value was read, one per CAPACITY_SIZES_MM2 */
  provenance: readonly Provenance[];
}

type Columns = Partial<Record<Method, CapacityColumn>>;

/**
 * A column as three runs: 1 mm², 1.5–35 mm², 50–240 mm², each with the source it was read from.
 * Throws when a run does not have its number of values (reference data that cannot be used).
 */
function col(
  table: string,
  one: [number, Provenance],
  core: [number[], Provenance],
  large: [number[], Provenance],
): CapacityColumn {
  if (core[0].length !== 8 || large[0].length !== 7) throw new Error(`capacity table ${table}: a run has the wrong number of values`);
  return {
    table,
    values: [one[0], ...core[0], ...large[0]],
    provenance: [one[1], ...core[0].map(() => core[1]), ...large[0].map(() => large[1])],
  };
}

// Each line: table, [1 mm²], [1.5 … 35 mm²], [50, 70, 95, 120, 150, 185, 240 mm²].
export const CAPACITY_CU: Record<'pvc70' | 'xlpe90', Record<Loaded, Columns>> = {
  pvc70: {
    2: {
      A1: col('B.52.2', [11, 'nbr-5410'], [[14.5, 19.5, 26, 34, 46, 61, 80, 99], 'ref'], [[119, 151, 182, 210, 240, 273, 321], 'iec-repro']),
      A2: col('B.52.2', [11, 'nbr-5410'], [[14, 18.5, 25, 32, 43, 57, 75, 92], 'ref'], [[110, 139, 167, 192, 219, 248, 291], 'iec-repro']),
      B1: col('B.52.2', [14, 'nbr-5410'], [[17.5, 24, 32, 41, 57, 76, 101, 125], 'ref'], [[151, 192, 232, 269, 300, 341, 400], 'iec-repro']),
      B2: col('B.52.2', [13, 'nbr-5410'], [[16.5, 23, 30, 38, 52, 69, 90, 111], 'ref'], [[133, 168, 201, 232, 258, 294, 344], 'iec-repro']),
      C: col('B.52.2', [15, 'nbr-5410'], [[19.5, 27, 36, 46, 63, 85, 112, 138], 'ref'], [[168, 213, 258, 299, 344, 392, 461], 'iec-repro']),
      D: col('B.52.2', [18, 'nbr-5410'], [[22, 29, 38, 47, 63, 81, 104, 125], 'nbr-5410'], [[148, 183, 216, 246, 278, 312, 361], 'nbr-5410']),
      E: col('B.52.10', [17, 'nbr-5410'], [[22, 30, 40, 51, 70, 94, 119, 148], 'ref'], [[180, 232, 282, 328, 379, 434, 514], 'iec-repro']),
    },
    3: {
      A1: col('B.52.4', [10, 'nbr-5410'], [[13.5, 18, 24, 31, 42, 56, 73, 89], 'ref'], [[108, 136, 164, 188, 216, 245, 286], 'iec-repro']),
      A2: col('B.52.4', [10, 'nbr-5410'], [[13, 17.5, 23, 29, 39, 52, 68, 83], 'ref'], [[99, 125, 150, 172, 196, 223, 261], 'iec-repro']),
      B1: col('B.52.4', [12, 'nbr-5410'], [[15.5, 21, 28, 36, 50, 68, 89, 110], 'ref'], [[134, 171, 207, 239, 262, 296, 346], 'iec-repro']),
      B2: col('B.52.4', [12, 'nbr-5410'], [[15, 20, 27, 34, 46, 62, 80, 99], 'ref'], [[118, 149, 179, 206, 225, 255, 297], 'iec-repro']),
      C: col('B.52.4', [14, 'nbr-5410'], [[17.5, 24, 32, 41, 57, 76, 96, 119], 'ref'], [[144, 184, 223, 259, 299, 341, 403], 'iec-repro']),
      D: col('B.52.4', [15, 'nbr-5410'], [[18, 24, 31, 39, 52, 67, 86, 103], 'nbr-5410'], [[122, 151, 179, 203, 230, 258, 297], 'nbr-5410']),
      E: col('B.52.10', [14, 'nbr-5410'], [[18.5, 25, 34, 43, 60, 80, 101, 126], 'ref'], [[153, 196, 238, 276, 319, 364, 430], 'nbr-5410']),
    },
  },
  xlpe90: {
    2: {
      A1: col('B.52.3', [15, 'nbr-5410'], [[19, 26, 35, 45, 61, 81, 106, 131], 'ref'], [[158, 200, 241, 278, 318, 362, 424], 'iec-repro']),
      A2: col('B.52.3', [14, 'nbr-5410'], [[18.5, 25, 33, 42, 57, 76, 99, 121], 'iec-repro'], [[145, 183, 220, 253, 290, 329, 386], 'iec-repro']),
      B1: col('B.52.3', [18, 'nbr-5410'], [[23, 31, 42, 54, 75, 100, 133, 164], 'ref'], [[198, 253, 306, 354, 393, 449, 528], 'iec-repro']),
      B2: col('B.52.3', [17, 'nbr-5410'], [[22, 30, 40, 51, 69, 91, 119, 146], 'iec-repro'], [[175, 221, 265, 305, 334, 384, 459], 'iec-repro']),
      C: col('B.52.3', [19, 'nbr-5410'], [[24, 33, 45, 58, 80, 107, 138, 171], 'ref'], [[209, 269, 328, 382, 441, 506, 599], 'iec-repro']),
      D: col('B.52.3', [21, 'nbr-5410'], [[26, 34, 44, 56, 73, 95, 121, 146], 'nbr-5410'], [[173, 213, 252, 287, 324, 363, 419], 'nbr-5410']),
      E: col('B.52.11', [21, 'nbr-5410'], [[26, 36, 49, 63, 86, 115, 149, 185], 'iec-repro'], [[225, 289, 352, 410, 473, 542, 641], 'iec-repro']),
    },
    3: {
      A1: col('B.52.5', [13, 'nbr-5410'], [[17, 23, 31, 40, 54, 73, 95, 117], 'iec-repro'], [[141, 179, 216, 249, 285, 324, 380], 'iec-repro']),
      A2: col('B.52.5', [13, 'nbr-5410'], [[16.5, 22, 30, 38, 51, 68, 89, 109], 'iec-repro'], [[130, 164, 197, 227, 259, 295, 346], 'iec-repro']),
      B1: col('B.52.5', [16, 'nbr-5410'], [[20, 28, 37, 48, 66, 88, 117, 144], 'iec-repro'], [[175, 222, 269, 312, 342, 384, 450], 'iec-repro']),
      B2: col('B.52.5', [15, 'nbr-5410'], [[19.5, 26, 35, 44, 60, 80, 105, 128], 'iec-repro'], [[154, 194, 233, 268, 300, 340, 398], 'iec-repro']),
      C: col('B.52.5', [17, 'nbr-5410'], [[22, 30, 40, 51, 70, 94, 119, 148], 'ref'], [[179, 229, 278, 322, 371, 424, 500], 'iec-repro']),
      D: col('B.52.5', [17, 'nbr-5410'], [[22, 29, 37, 46, 61, 79, 101, 122], 'nbr-5410'], [[144, 178, 211, 240, 271, 304, 351], 'nbr-5410']),
      E: col('B.52.11', [18, 'nbr-5410'], [[23, 32, 42, 54, 75, 100, 127, 158], 'nbr-5410'], [[192, 246, 298, 346, 399, 456, 538], 'nbr-5410']),
    },
  },
};
