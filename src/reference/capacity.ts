// Source: IEC 60364-5-52:2009 Annex B — current-carrying capacities (A) of copper conductors,
// 30 °C ambient air (20 °C ground for method D), by insulation, loaded conductors and reference
// method: Tables B.52.2 (PVC, 2 loaded), B.52.3 (XLPE, 2 loaded), B.52.4 (PVC, 3 loaded),
// B.52.5 (XLPE, 3 loaded), B.52.10 (PVC, method E), B.52.11 (XLPE, method E).
// Values quoted in packsmith's REFERENCE.md are marked "ref"; the rest were brought from the
// standard's tables without the document at hand and are marked "from memory".
// Method D is the 2001 edition's single buried method (in ducts in the ground, 2.5 K·m/W).
// Method F (single-core cables touching) begins at 25 mm² in the standard and is not held here.

export type Method = 'A1' | 'A2' | 'B1' | 'B2' | 'C' | 'D' | 'E' | 'F';
export type Loaded = 2 | 3;

/** conductor sizes of every column below, mm² */
export const CAPACITY_SIZES_MM2 = [1.5, 2.5, 4, 6, 10, 16, 25, 35] as const;

export interface CapacityColumn {
  table: string;
  values: readonly number[];
  /** "ref": quoted in REFERENCE.md; "from memory": see the header */
  provenance: 'ref' | 'from memory';
}

type Columns = Partial<Record<Method, CapacityColumn>>;

const col = (table: string, provenance: CapacityColumn['provenance'], values: number[]): CapacityColumn => ({ table, values, provenance });

export const CAPACITY_CU: Record<'pvc70' | 'xlpe90', Record<Loaded, Columns>> = {
  pvc70: {
    2: {
      A1: col('B.52.2', 'ref', [14.5, 19.5, 26, 34, 46, 61, 80, 99]),
      A2: col('B.52.2', 'ref', [14, 18.5, 25, 32, 43, 57, 75, 92]),
      B1: col('B.52.2', 'ref', [17.5, 24, 32, 41, 57, 76, 101, 125]),
      B2: col('B.52.2', 'ref', [16.5, 23, 30, 38, 52, 69, 90, 111]),
      C: col('B.52.2', 'ref', [19.5, 27, 36, 46, 63, 85, 112, 138]),
      D: col('B.52.2', 'from memory', [22, 29, 38, 47, 63, 81, 104, 125]),
      E: col('B.52.10', 'ref', [22, 30, 40, 51, 70, 94, 119, 148]),
    },
    3: {
      A1: col('B.52.4', 'ref', [13.5, 18, 24, 31, 42, 56, 73, 89]),
      A2: col('B.52.4', 'ref', [13, 17.5, 23, 29, 39, 52, 68, 83]),
      B1: col('B.52.4', 'ref', [15.5, 21, 28, 36, 50, 68, 89, 110]),
      B2: col('B.52.4', 'ref', [15, 20, 27, 34, 46, 62, 80, 99]),
      C: col('B.52.4', 'ref', [17.5, 24, 32, 41, 57, 76, 96, 119]),
      D: col('B.52.4', 'from memory', [18, 24, 31, 39, 52, 67, 86, 103]),
      E: col('B.52.10', 'ref', [18.5, 25, 34, 43, 60, 80, 101, 126]),
    },
  },
  xlpe90: {
    2: {
      A1: col('B.52.3', 'ref', [19, 26, 35, 45, 61, 81, 106, 131]),
      A2: col('B.52.3', 'from memory', [18.5, 25, 33, 42, 57, 76, 99, 121]),
      B1: col('B.52.3', 'ref', [23, 31, 42, 54, 75, 100, 133, 164]),
      B2: col('B.52.3', 'from memory', [22, 30, 40, 51, 69, 91, 119, 146]),
      C: col('B.52.3', 'ref', [24, 33, 45, 58, 80, 107, 138, 171]),
      D: col('B.52.3', 'from memory', [26, 34, 44, 56, 73, 95, 121, 146]),
      E: col('B.52.11', 'from memory', [26, 36, 49, 63, 86, 115, 149, 185]),
    },
    3: {
      A1: col('B.52.5', 'from memory', [17, 23, 31, 40, 54, 73, 95, 117]),
      A2: col('B.52.5', 'from memory', [16.5, 22, 30, 38, 51, 68, 89, 109]),
      B1: col('B.52.5', 'from memory', [20, 28, 37, 48, 66, 88, 117, 144]),
      B2: col('B.52.5', 'from memory', [19.5, 26, 35, 44, 60, 80, 105, 128]),
      C: col('B.52.5', 'ref', [22, 30, 40, 51, 70, 94, 119, 148]),
      D: col('B.52.5', 'from memory', [22, 29, 37, 46, 61, 79, 101, 122]),
      E: col('B.52.11', 'from memory', [23, 32, 42, 54, 75, 100, 127, 158]),
    },
  },
};
