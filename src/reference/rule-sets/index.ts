// Source: rule-sets/iec-60364.ts and rule-sets/bs-7671.ts — the sets a job may choose. A set gives
// only what differs from IEC 60364; calc/rules.ts fills in the rest from IEC 60364.
import { BS_7671 } from './bs-7671.js';
import { IEC_60364 } from './iec-60364.js';
import type { RuleSetData, RuleSetId } from './types.js';

export type { RuleSet, RuleSetData, RuleSetId, Premises, AdditionalProtection } from './types.js';
export { IEC_60364 } from './iec-60364.js';

export const RULE_SET_IDS = ['iec-60364', 'bs-7671'] as const satisfies readonly RuleSetId[];

export const RULE_SET_DATA: Record<RuleSetId, RuleSetData> = {
  'iec-60364': IEC_60364,
  'bs-7671': BS_7671,
};
