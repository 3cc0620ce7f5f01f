// Minimum size of a separate protective conductor — one that is not a core of the cable nor in a
// common enclosure with it (cpc_in_cable: no): 2.5 mm² copper where mechanically protected,
// 4 mm² where not (IEC 60364-5-54 / BS 7671, 543.1.3). An unrecorded protection is taken as none.
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { SEPARATE_CPC_CLAUSE, SEPARATE_CPC_MIN_MM2 } from '../../reference/separate-cpc.js';
import { notApplicable, result } from './result.js';

const id = 'cpc-size';

export const cpcSize: Check = ({ circuit }) => {
  if (circuit.cpc_in_cable) return notApplicable(id, 'the cpc is a core of the cable: no separate minimum size (543.1.3 applies to a separate cpc)');
  const min = SEPARATE_CPC_MIN_MM2[circuit.conductor];
  const limit = circuit.cpc_protected ? min.protected : min.unprotected;
  const material = circuit.conductor === 'cu' ? 'copper' : 'aluminium';
  const how = circuit.cpc_protected ? 'mechanically protected' : 'not recorded as mechanically protected (cpc_protected)';
  const ok = circuit.cpc_mm2 >= limit;
  return result(id, ok ? 'pass' : 'fail',
    `separate cpc ${fmt(circuit.cpc_mm2)} mm² ${material}, ${how}: ${ok ? '≥' : '<'} ${fmt(limit)} mm² (${SEPARATE_CPC_CLAUSE})`,
    { value: circuit.cpc_mm2, limit, unit: 'mm2' });
};
