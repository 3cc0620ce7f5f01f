// Which circuits take the Table 41.1 times (point 1) and the rule sets as data (point 3).
import { describe, expect, it } from 'vitest';
import { requiredDisconnection, resolveRules, ruleSet } from '../../src/calc/rules.js';
import { RulesSchema, SupplySchema } from '../../src/model/schema.js';
import { assess } from '../../src/calc/assess.js';
import { context } from '../helpers/context.js';
import { project } from '../helpers/project.js';

const tn = { ze_ohm: '0.2', pfc_ka: '2' };
const required = (c: Record<string, string>, rules: Record<string, unknown> = {}) =>
  context({ live_mm2: '16', cpc_mm2: '6', ib_a: '30', ...c }, {}, tn, undefined, { rules }).derived.required_disconnect_s;

describe('final circuits with socket-outlets up to 63 A, fixed equipment up to 32 A (IEC 60364-4-41 / BS 7671, 411.3.2.2)', () => {
  it('a 63 A socket-outlet circuit gets 0.4 s in TN at 230 V (Table 41.1); before, every circuit above 32 A got 5 s', () => {
    expect(required({ rating_a: '63', kind: 'power', sockets: 'yes' })).toBe(0.4);
  });
  it('a cooker circuit with a socket-outlet on its control unit gets 0.4 s', () => {
    expect(required({ rating_a: '40', kind: 'heating', sockets: 'yes', description: 'Cooker with socket on the control unit' })).toBe(0.4);
  });
  it('a 40 A circuit for fixed equipment only gets 5 s (411.3.2.3); an 80 A socket circuit too', () => {
    expect(required({ rating_a: '40', kind: 'heating' })).toBe(5);
    expect(required({ rating_a: '80', kind: 'power', live_mm2: '25', cpc_mm2: '16' })).toBe(5);
  });
  it('sockets defaults to yes for kind power, else no (CONTRACT.md)', () => {
    expect(required({ rating_a: '40', kind: 'power' })).toBe(0.4);
    expect(required({ rating_a: '40', kind: 'power', sockets: 'no' })).toBe(5);
  });
  it('TT: 0.2 s for a 63 A socket circuit (Table 41.1, TT, 120–230 V)', () => {
    const c = context({ rating_a: '63', kind: 'power', live_mm2: '16', cpc_mm2: '6' }, {}, { earthing: 'TT', ze_ohm: '21', ra_ohm: '20' });
    expect(c.derived.required_disconnect_s).toBe(0.2);
  });
  it('keeps the superseded final_circuit_limit_a working: it sets both limits, as before', () => {
    const r = resolveRules(SupplySchema.parse({ earthing: 'TN-S' }), RulesSchema.parse({ final_circuit_limit_a: 63 }));
    expect([r.final_socket_limit_a, r.final_fixed_limit_a]).toEqual([63, 63]);
    expect(requiredDisconnection('TN-S', 230, { rating_a: 50, kind: 'heating', sockets: undefined, disconnect_s: undefined }, r).seconds).toBe(0.4);
  });
});

describe('rule sets as data (point 3)', () => {
  it('each set names itself and its source; BS 7671 falls back to IEC 60364 for what it does not say', () => {
    const iec = ruleSet('iec-60364');
    const bs = ruleSet('bs-7671');
    expect(iec.name).toBe('IEC 60364');
    expect(bs.name).toBe('BS 7671');
    expect(bs.source).toMatch(/BS 7671/);
    // values BS 7671 does not restate are IEC 60364's (Cmin 0.95: IEC 60909-0 Table 1; 411.3.2.2 limits)
    expect([bs.cmin, bs.final_socket_limit_a, bs.final_fixed_limit_a, bs.vd_other_percent]).toEqual([0.95, 63, 32, 5]);
    expect(bs.additional_protection.sockets_upto_a).toBe(32); // 411.3.3, both sets
    expect(bs.additional_protection.luminaires_in_dwellings).toBe(true); // BS 7671 411.3.4
    expect(iec.additional_protection.luminaires_in_dwellings).toBe(false);
  });
  it('the assessment names the set it used', () => {
    const a = assess(project([{}], { rules: { set: 'bs-7671' } }));
    expect(a.rules.set).toBe('bs-7671');
    expect(a.rules.set_name).toBe('BS 7671');
  });
});
