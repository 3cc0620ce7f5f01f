// Continuity of protective conductors: measured R1+R2 against the R1+R2 the cable explains
// (derived r1r2_expected_ohm at 20 °C, the reference temperature of IEC 60228, taken as the test
// temperature: a test at 10 °C reads about 4 % lower, well inside the tolerance). Well above it —
// beyond the rule set's tolerance, 25 % + 0.05 Ω by default (common practice) — is `attention`:
// a poor joint or a longer route than recorded. Ze at the board (as the design takes it) + R1+R2 above
// the fault protection limit is a `fail`; the reading is taken cold, so it is first raised to the
// conductor's temperature in service by the resistance ratio R(θ)/R(20 °C) = 1 + α (θ − 20)
// (IEC 60287-1-1 α; θ the insulation's maximum operating temperature), never compared cold with
// the hot limit. No test temperature is read: a missing one could only
// loosen the query, and a missing reading must never move a verdict towards a pass.
import type { Check } from '../types.js';
import { fmt, toPlaces } from '../../model/units.js';
import { faultProtection } from '../fault-protection.js';
import { ALPHA20_PER_K, OPERATING_TEMP_C } from '../../reference/conductors.js';
import { numberOf, result, shown, toFiveFigures, unusable } from './result.js';

const id = 'continuity';
const round = (n: number) => toPlaces(n, 3);

export const continuity: Check = (ctx) => {
  const { readings, rules, board, supply } = ctx;
  const m = readings.r1r2_ohm;
  const missing = unusable(id, 'measured R1+R2', m);
  if (missing) return missing;
  const r = numberOf(m!);
  const date = m!.date;
  const measured = `measured R1+R2 ${shown(r, 'Ω')}`;
  const reading = { value: r.value, unit: 'ohm', date, over_range: r.kind === 'at-least' };

  // The loop: Ze at the board + R1+R2 against the fault protection limit.
  const fp = faultProtection(ctx);
  // the board's source impedance as the design takes it: a Zdb measured below Ze (a slip, or a
  // reading of the wrong board) does not lower the loop, which holds Ze whatever is measured
  const given = board.zdb_ohm ?? supply.ze_ohm;
  const source = ctx.design.source;
  const ze = source ? source.ohm : given;
  const zeWords = source && source.ohm !== given ? source.words : board.zdb_ohm !== undefined ? `Zdb ${fmt(board.zdb_ohm)} Ω at ${board.id}` : `Ze ${fmt(ze ?? 0)} Ω`;
  const theta = OPERATING_TEMP_C[ctx.circuit.insulation];
  const ratio = 1 + ALPHA20_PER_K[ctx.circuit.conductor] * (theta - 20);
  const hot = `R1+R2 × ${fmt(ratio)} (resistance ratio ${theta} °C / 20 °C, IEC 60287-1-1)`;
  if (ze !== undefined && fp.limit_ohm !== null) {
    const loop = ze + r.value * ratio;
    // ">N" is above N: at or beyond the limit it is a fail
    if (loop > fp.limit_ohm || (r.kind === 'at-least' && loop >= fp.limit_ohm)) {
      return result(id, 'fail', `${zeWords} + ${measured} × ${fmt(ratio)} (resistance ratio ${theta} °C / 20 °C, IEC 60287-1-1) = ${r.kind === 'at-least' ? '>' : ''}${fmt(loop)} Ω > ${fmt(fp.limit_ohm)} Ω${toFiveFigures(loop, '>', fp.limit_ohm, 'Ω')} (${fp.basis})`,
        { ...reading, limit: Math.max(0, round((fp.limit_ohm - ze) / ratio)) }); // Ze alone over the limit: no R1+R2 passes
    }
  }
  const expected = ctx.derived.r1r2_expected_ohm ?? null;
  if (expected === null) return result(id, 'not-verified', `${measured}: the R1+R2 expected of the cable is not known, so the reading cannot be judged`, reading);
  if (ze === undefined) return result(id, 'not-verified', `${measured}: no measured Ze (supply.ze_ohm) or Zdb for ${board.id}, so Ze + R1+R2 cannot be compared with the limit`, reading);
  if (fp.limit_ohm === null) return result(id, 'not-verified', `${measured}: no limit for Ze + R1+R2: ${fp.basis}`, reading);

  // The cable: the expected value with the tolerance.
  const bound = expected * (1 + rules.r1r2_tolerance_percent / 100) + rules.r1r2_tolerance_ohm;
  // the limit the reading is compared with comes first, so the inequality reads true as written
  const tolerance = `${fmt(bound)} Ω (expected ${fmt(expected)} Ω at 20 °C + ${rules.r1r2_tolerance_percent} % + ${rules.r1r2_tolerance_ohm} Ω; common practice)`;
  const loop = `${zeWords} + ${hot} = ${fmt(ze + r.value * ratio)} Ω ≤ ${fmt(fp.limit_ohm)} Ω (${fp.by === 'rcd' ? 'IEC 60364-4-41, 411.5.3' : 'max Zs for the required time'})`;
  const numbers = { ...reading, limit: round(bound) };
  if (r.value > bound || (r.kind === 'at-least' && r.value >= bound)) {
    return result(id, 'attention', `${measured} > ${tolerance}: more than the cable length explains (a poor joint or a longer route?); ${loop}`, numbers);
  }
  if (r.kind === 'at-least') return result(id, 'not-verified', `${measured} (over range) cannot show ≤ ${tolerance}`, numbers);
  return result(id, 'pass', `${measured} ≤ ${tolerance}; ${loop}`, numbers);
};
