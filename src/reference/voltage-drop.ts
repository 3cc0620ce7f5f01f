// Source: IEC 60364-5-52:2009 Annex G — Table G.52.1 (maximum voltage drop for installations
// supplied from a public LV network: lighting 3 %, other uses 5 %) and G.52.2 (the reactance per
// unit length of conductors taken as 0.08 mΩ/m in the absence of other details).

export const VD_LIMIT_PERCENT = { lighting: 3, other: 5 } as const;

/** reactance per conductor, mΩ/m */
export const REACTANCE_MOHM_PER_M = 0.08;

/** below this size reactance is negligible beside resistance (common practice: BS 7671 Appendix 4 tabulates x from 25 mm²) */
export const REACTANCE_FROM_MM2 = 25;
