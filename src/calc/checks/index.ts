// The registry of checks, in the order a pack lists them (CONTRACT.md check ids).
import type { Check, CheckId } from '../types.js';
import { continuity } from './continuity.js';
import { insulation } from './insulation.js';
import { pending } from './pending.js';
import { polarity } from './polarity.js';
import { rcd } from './rcd.js';
import { rcdTt } from './rcd-tt.js';
import { ring } from './ring.js';
import { zsMeasured } from './zs-measured.js';

export const CHECKS: readonly (readonly [CheckId, Check])[] = [
  ['overload', pending('overload', 'overload protection Ib ≤ In ≤ Iz')],
  ['voltage-drop', pending('voltage-drop', 'voltage drop')],
  ['zs-design', pending('zs-design', 'design Zs against max Zs')],
  ['disconnection', pending('disconnection', 'disconnection time at the design fault current')],
  ['adiabatic', pending('adiabatic', 'protective conductor size (adiabatic)')],
  ['breaking-capacity', pending('breaking-capacity', 'breaking capacity against the prospective fault current')],
  ['continuity', continuity],
  ['ring', ring],
  ['insulation', insulation],
  ['polarity', polarity],
  ['zs-measured', zsMeasured],
  ['rcd', rcd],
  ['rcd-tt', rcdTt],
];
