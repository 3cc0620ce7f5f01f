// Source: IEC 60287-1-1:2006, Table 1 — temperature coefficient of electrical resistance at 20 °C
// (per kelvin), used as R(θ) = R20 × (1 + α (θ − 20)).

export const ALPHA_20_PER_K = { cu: 0.00393, al: 0.00403 } as const;

/** the reference temperature of conductor resistances (IEC 60228) */
export const REFERENCE_TEMPERATURE_C = 20;
