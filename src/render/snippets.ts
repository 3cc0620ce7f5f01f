// The curve snippet of one circuit: its device's band, the fault point, the required time.
// `snippetRequest` says what to draw (and, as a caption, how the fault point was found);
// `circuitSnippet` draws it with the device library's band (snippet.ts).
import type { CircuitRecord } from '../model/validate.js';
import type { CircuitReadings } from '../model/readings.js';
import type { CircuitAssessment, Derived } from '../calc/types.js';
import type { Rules } from '../calc/rules.js';
import { fmt } from '../model/units.js';
import type { Device } from '../calc/devices/index.js';
import { curveSnippet } from './snippet.js';

export interface SnippetRequest {
  device: Device;
  faultCurrentA: number | null;
  requiredS: number | null;
  title: string;
  /** a feeding circuit: the largest device of the board it feeds, drawn beside its own band, up to the fault current there */
  downstream?: { device: Device; label: string; uptoA: number | null };
}

export interface SnippetPlan {
  request: SnippetRequest;
  /** one line under the snippet: where the fault point comes from */
  caption: string;
}

export function snippetRequest(
  circuit: CircuitRecord, derived: Partial<Derived>, readings: CircuitReadings, rules: Rules, feeds?: CircuitAssessment['feeds'],
): SnippetPlan {
  const device = { code: circuit.device, rating_a: circuit.rating_a };
  const requiredS = derived.required_disconnect_s ?? null;
  const title = `${circuit.board} ${circuit.ref}: ${circuit.device} ${fmt(circuit.rating_a)} A`;
  const required = requiredS === null ? 'no required time' : `required within ${fmt(requiredS)} s`;
  const zs = readings.zs_ohm;
  let faultCurrentA: number | null = null;
  let caption: string;
  if (zs && zs.value.kind === 'value' && zs.value.value > 0) {
    // Minimum earth fault current at the measured loop impedance, I = U0 × Cmin / Zs: the same
    // relation that gives max Zs = U0 × Cmin / Ia (IEC 60364-4-41, 411.4.4; Cmin per CENELEC TR 50480).
    faultCurrentA = (rules.u0_v * rules.cmin) / zs.value.value;
    caption = `fault point at measured Zs ${fmt(zs.value.value)} Ω (${zs.date}): ${fmt(rules.u0_v)} V × ${fmt(rules.cmin)} / ${fmt(zs.value.value)} Ω = ${fmt(faultCurrentA)} A; ${required}`;
  } else if (zs && zs.value.kind === 'at-least') {
    caption = `measured Zs over range (> ${fmt(zs.value.value)} Ω, ${zs.date}): no fault point; ${required}`;
  } else if (typeof derived.fault_current_a === 'number') {
    faultCurrentA = derived.fault_current_a;
    caption = `fault point at design Zs${typeof derived.zs_design_ohm === 'number' ? ` ${fmt(derived.zs_design_ohm)} Ω` : ''}: ${fmt(faultCurrentA)} A (no measured Zs); ${required}`;
  } else {
    caption = `no measured or design Zs: no fault point; ${required}`;
  }
  const largest = feeds?.largest;
  if (feeds && largest) {
    const downstream = { device: { code: largest.code, rating_a: largest.rating_a }, label: `${feeds.board}/${largest.ref} ${largest.code} ${fmt(largest.rating_a)} A`, uptoA: feeds.fault_current_a };
    caption += `; hatched: ${downstream.label}, the largest device on ${feeds.board}, for selectivity${feeds.fault_current_a === null ? '' : ` up to ${fmt(feeds.fault_current_a)} A`}`;
    return { request: { device, faultCurrentA, requiredS, title, downstream }, caption };
  }
  return { request: { device, faultCurrentA, requiredS, title }, caption };
}

/**
 * An SVG of the request for a pack: the band (or a note that the library has none), the fault
 * point, the required time; without a stylesheet of its own (the pack holds CURVE_CSS once).
 */
export function circuitSnippet(request: SnippetRequest): string {
  return curveSnippet(request, { style: false });
}
