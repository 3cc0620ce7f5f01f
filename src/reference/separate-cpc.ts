// Source: IEC 60364-5-54:2011, 543.1.3 (BS 7671 543.1.3 the same) — a protective conductor that is
// not a core of a cable nor in a common enclosure with the line conductors is at least 2.5 mm²
// copper where mechanically protected, 4 mm² copper where not (REFERENCE.md); aluminium 16 mm²
// in both cases (from memory).
import type { Material } from './conductors.js';

export const SEPARATE_CPC_MIN_MM2: Record<Material, { protected: number; unprotected: number }> = {
  cu: { protected: 2.5, unprotected: 4 },
  al: { protected: 16, unprotected: 16 },
};

export const SEPARATE_CPC_CLAUSE = 'IEC 60364-5-54, 543.1.3';
