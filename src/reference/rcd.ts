// Source: IEC 61008-1 (RCCBs) and IEC 61009-1 (RCBOs) — limit values of break time and
// non-actuating time for a.c. residual currents, as reproduced in packsmith REFERENCE.md (the
// table numbers differ between editions): general type at most 300 /
// 150 / 40 ms at 1 / 2 / 5 × IΔn; type S (time-delayed) at most 500 / 200 / 150 ms and at least
// (non-actuating time) 130 / 60 / 50 ms.

export type RcdKind = 'general' | 'S';

export interface BreakTimes {
  /** multiple of IΔn the test is made at */
  multiple: 1 | 2 | 5;
  max_ms: number;
  /** shortest time the device must hold (type S only) */
  min_ms: number | null;
}

export const RCD_BREAK_TIMES: Record<RcdKind, readonly BreakTimes[]> = {
  general: [
    { multiple: 1, max_ms: 300, min_ms: null },
    { multiple: 2, max_ms: 150, min_ms: null },
    { multiple: 5, max_ms: 40, min_ms: null },
  ],
  S: [
    { multiple: 1, max_ms: 500, min_ms: 130 },
    { multiple: 2, max_ms: 200, min_ms: 60 },
    { multiple: 5, max_ms: 150, min_ms: 50 },
  ],
};
