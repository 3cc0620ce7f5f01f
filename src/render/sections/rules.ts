// The rule set section: the rule set, each parameter with where its value came from, and the
// circuits that set a value of their own.
import type { Project } from '../../model/validate.js';
import type { Assessment } from '../../calc/types.js';
import { fmt } from '../../model/units.js';
import { JOB_LABELS } from '../labels.js';

const RULE_KEYS = ['cmin', 'measured_zs_factor', 'vd_lighting_percent', 'vd_other_percent', 'final_socket_limit_a', 'final_fixed_limit_a'] as const;

export function rulesView(project: Project, assessment: Assessment) {
  const { overrides } = assessment.rules;
  const circuitOverrides = project.circuits
    .filter((c) => c.disconnect_s !== undefined)
    .map((c) => `${c.board} ${c.ref}: required disconnection time ${fmt(c.disconnect_s!)} s, set for this circuit`);
  return {
    set: assessment.rules.set,
    setName: assessment.rules.set_name,
    setSource: assessment.rules.set_source,
    premises: assessment.rules.premises,
    u0_v: assessment.rules.u0_v,
    params: RULE_KEYS.map((key) => {
      const l = JOB_LABELS[`rules.${key}`]!;
      return { label: l.label, value: assessment.rules[key], unit: l.unit ?? '', overridden: overrides.includes(key) || (overrides.includes('final_circuit_limit_a') && key.startsWith('final_')) };
    }),
    circuitOverrides,
    anyOverride: overrides.length > 0 || circuitOverrides.length > 0,
  };
}
