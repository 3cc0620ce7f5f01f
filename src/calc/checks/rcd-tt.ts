// TT supply with an RCD: RA × IΔn ≤ 50 V (IEC 60364-4-41, 411.5.3), RA the installation earth
// electrode resistance (supply.ra_ohm). An electrode above 200 Ω is queried even when it meets the
// condition: it may not stay stable (common practice; the figure from memory).
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { ELECTRODE_QUERY_ABOVE_OHM, TOUCH_VOLTAGE_LIMIT_V } from '../../reference/touch-voltage.js';
import { notApplicable, notVerified, result } from './result.js';

const id = 'rcd-tt';

export const rcdTt: Check = ({ circuit, supply }) => {
  if (supply.earthing !== 'TT') return notApplicable(id, `${supply.earthing} supply: no earth electrode condition`);
  if (circuit.rcd_ma === undefined) return notApplicable(id, 'no RCD on this circuit: fault protection by the overcurrent device (see zs-measured)');
  const ra = supply.ra_ohm;
  if (ra === undefined) return notVerified(id, 'RA × IΔn ≤ 50 V: the earth electrode resistance RA is not recorded (supply.ra_ohm in project.yaml)');
  // rounded so that 500 Ω × 100 mA is 50 V exactly, as a reader would work it out
  const touch = Number((ra * (circuit.rcd_ma / 1000)).toFixed(9));
  const sum = `RA ${fmt(ra)} Ω × IΔn ${fmt(circuit.rcd_ma)} mA = ${fmt(touch)} V`;
  const rule = `${TOUCH_VOLTAGE_LIMIT_V} V (IEC 60364-4-41, 411.5.3)`;
  const numbers = { value: touch, limit: TOUCH_VOLTAGE_LIMIT_V, unit: 'V' };
  if (touch > TOUCH_VOLTAGE_LIMIT_V) return result(id, 'fail', `${sum} > ${rule}`, numbers);
  if (ra > ELECTRODE_QUERY_ABOVE_OHM) {
    return result(id, 'attention', `${sum} ≤ ${rule}, but RA above ${ELECTRODE_QUERY_ABOVE_OHM} Ω may not be stable (common practice)`, numbers);
  }
  return result(id, 'pass', `${sum} ≤ ${rule}`, numbers);
};
