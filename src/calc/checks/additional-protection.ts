// Additional protection by an RCD of IΔn ≤ 30 mA, not time-delayed, where the rule set requires it
// (rules.additional_protection): socket-outlets up to 32 A and mobile equipment up to 32 A used
// outdoors (IEC 60364-4-41 / BS 7671, 411.3.3); under BS 7671 also a.c. final circuits supplying
// luminaires in dwellings (411.3.4) and cables concealed less than 50 mm deep without earthed
// covering or mechanical protection (522.6.202/203). A time-delayed (S) RCD does not give it; an RCD
// of unrecorded type cannot be shown to. Without it: `fail`, or `attention` with the documented
// reason (rcd_exemption) where the set allows one — for socket-outlets other than in dwellings.
// The socket-outlet and outdoor rules are on the socket-outlet's or the equipment's rating, which
// circuits.csv does not record: on a circuit above it the requirement is uncertain, and the RCD's
// absence `attention`, never `n/a`.
import type { Check } from '../types.js';
import { fmt } from '../../model/units.js';
import { hasSockets } from '../circuit-facts.js';
import { notApplicable, result } from './result.js';

const id = 'additional-protection';

export const additionalProtection: Check = ({ circuit, rules }) => {
  const ap = rules.additional_protection;
  const dwelling = rules.premises === 'dwelling';
  const reasons: { why: string; clause: string; exemptable: boolean; unsure?: true }[] = [];
  const exemptable = ap.socket_exemption_outside_dwellings && !dwelling;
  if (hasSockets(circuit) && circuit.rating_a <= ap.sockets_upto_a) {
    reasons.push({ why: `socket-outlets on a ${fmt(circuit.rating_a)} A circuit (up to ${ap.sockets_upto_a} A)`, clause: ap.clauses.sockets, exemptable });
  } else if (hasSockets(circuit)) {
    // the rule is on the socket-outlet's own rating, which circuits.csv does not record: a circuit
    // above it may still supply smaller ones (a cooker control unit's socket-outlet)
    reasons.push({ why: `socket-outlets rated up to ${ap.sockets_upto_a} A, if this ${fmt(circuit.rating_a)} A circuit's are (their rating is not recorded; a cooker control unit's, for one, is smaller)`, clause: ap.clauses.sockets, exemptable, unsure: true });
  }
  if (circuit.outdoors && circuit.rating_a <= ap.outdoor_upto_a) {
    reasons.push({ why: `equipment used outdoors on a ${fmt(circuit.rating_a)} A circuit (up to ${ap.outdoor_upto_a} A)`, clause: ap.clauses.outdoor, exemptable: false });
  } else if (circuit.outdoors) {
    reasons.push({ why: `mobile equipment rated up to ${ap.outdoor_upto_a} A used outdoors, if this ${fmt(circuit.rating_a)} A circuit supplies any (the equipment's rating is not recorded)`, clause: ap.clauses.outdoor, exemptable: false, unsure: true });
  }
  if (ap.luminaires_in_dwellings && dwelling && circuit.kind === 'lighting') {
    reasons.push({ why: 'luminaires in a dwelling', clause: ap.clauses.luminaires, exemptable: false });
  }
  if (ap.concealed_cables && circuit.concealed) {
    reasons.push({ why: 'cable concealed less than 50 mm deep without earthed covering or mechanical protection', clause: ap.clauses.concealed, exemptable: false });
  }
  if (reasons.length === 0) {
    return notApplicable(id, `not required by ${rules.set_name}: no socket-outlets up to ${ap.sockets_upto_a} A, no equipment used outdoors${ap.luminaires_in_dwellings ? ', no luminaires in a dwelling' : ''}${ap.concealed_cables ? ', no concealed cable' : ''}`);
  }
  const required = `required for ${reasons.map((r) => `${r.why} (${r.clause})`).join('; ')}`;
  const numbers = { value: circuit.rcd_ma ?? null, limit: ap.max_ma, unit: 'mA' };
  const ma = circuit.rcd_ma;
  const delayed = circuit.rcd_type?.endsWith('-S') ?? false;
  if (ma !== undefined && ma <= ap.max_ma && !delayed) {
    if (circuit.rcd_type === undefined) {
      return result(id, 'attention', `${fmt(ma)} mA RCD of unrecorded type: a time-delayed (S) RCD does not give additional protection, so rcd_type is needed; ${required}`, numbers);
    }
    return result(id, 'pass', `${fmt(ma)} mA type ${circuit.rcd_type} RCD ≤ ${ap.max_ma} mA, not time-delayed: additional protection ${required}`, numbers);
  }
  const lacking = ma === undefined ? 'no RCD' : delayed ? `a time-delayed ${fmt(ma)} mA RCD (type ${circuit.rcd_type}) does not give additional protection` : `the ${fmt(ma)} mA RCD is above ${ap.max_ma} mA`;
  const exemption = circuit.rcd_exemption?.trim();
  if (exemption && reasons.every((r) => r.exemptable)) {
    return result(id, 'attention', `${lacking}; ${required}; omitted under ${ap.clauses.exemption}: "${exemption}"`, numbers);
  }
  const refused = exemption ? `; the exemption given ("${exemption}") is not allowed here${dwelling ? ' (premises: dwelling)' : ''}` : '';
  if (reasons.every((r) => r.unsure)) {
    return result(id, 'attention', `${lacking}: an RCD of IΔn ≤ ${ap.max_ma} mA, not time-delayed, is ${required}${refused}`, numbers);
  }
  return result(id, 'fail', `${lacking}: an RCD of IΔn ≤ ${ap.max_ma} mA, not time-delayed, is ${required}${refused}`, numbers);
};
