// The registry of checks, in the order a pack lists them (CONTRACT.md check ids).
import type { Check, CheckId } from '../types.js';
import { adiabatic } from './adiabatic.js';
import { additionalProtection } from './additional-protection.js';
import { cpcSize } from './cpc-size.js';
import { breakingCapacity } from './breaking-capacity.js';
import { continuity } from './continuity.js';
import { disconnection } from './disconnection.js';
import { insulation } from './insulation.js';
import { overload } from './overload.js';
import { polarity } from './polarity.js';
import { rcd } from './rcd.js';
import { rcdTt } from './rcd-tt.js';
import { ring } from './ring.js';
import { selectivity } from './selectivity.js';
import { voltageDropCheck } from './voltage-drop.js';
import { zsDesign } from './zs-design.js';
import { zsMeasured } from './zs-measured.js';

export const CHECKS: readonly (readonly [CheckId, Check])[] = [
  ['overload', overload],
  ['voltage-drop', voltageDropCheck],
  ['zs-design', zsDesign],
  ['disconnection', disconnection],
  ['adiabatic', adiabatic],
  ['cpc-size', cpcSize],
  ['breaking-capacity', breakingCapacity],
  ['continuity', continuity],
  ['ring', ring],
  ['insulation', insulation],
  ['polarity', polarity],
  ['zs-measured', zsMeasured],
  ['rcd', rcd],
  ['rcd-tt', rcdTt],
  ['additional-protection', additionalProtection],
  ['selectivity', selectivity],
];
