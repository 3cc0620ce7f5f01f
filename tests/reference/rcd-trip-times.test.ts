// RCD break times at 1 × and 5 × IΔn, general and time-delayed (S) types.
import { describe, expect, it } from 'vitest';
import { rcd } from '../../src/calc/checks/rcd.js';
import { context } from '../helpers/context.js';

const rcdCircuit = (type?: string) => ({ device: 'rcbo:B', rating_a: '20', rcd_ma: '30', ...(type ? { rcd_type: type } : {}) });
const trip = (type: string | undefined, x1: string, x5: string, button = 'ok') =>
  rcd(context(rcdCircuit(type), { rcd_1x_ms: x1, rcd_5x_ms: x5, rcd_button: button }));

describe('RCD trip times, general type (IEC 61008-1 / IEC 61009-1)', () => {
  it('opens within 300 ms at 1 × IΔn', () => {
    expect(trip('A', '300', '20').status).toBe('pass'); // IEC 61008-1: general type, IΔn, 300 ms
    expect(trip('A', '301', '20').status).toBe('fail');
  });
  it('opens within 40 ms at 5 × IΔn', () => {
    expect(trip('AC', '25', '40').status).toBe('pass'); // IEC 61008-1: general type, 5 IΔn, 40 ms
    const r = trip('AC', '25', '41');
    expect(r.status).toBe('fail');
    expect(r).toMatchObject({ value: 41, limit: 40, unit: 'ms' });
    expect(r.basis).toMatch(/5 × IΔn 41 ms > 40 ms/);
  });
  it('takes general-type limits when the type is not recorded, and says so', () => {
    const r = trip(undefined, '250', '35');
    expect(r.status).toBe('pass');
    expect(r.basis).toMatch(/unrecorded type, general-type limits/);
  });
  it('names the standard of the device: IEC 61009-1 for an RCBO, IEC 61008-1 for an RCD beside an MCB', () => {
    expect(trip('A', '20', '10').basis).toContain('IEC 61009-1');
    const rccb = rcd(context({ device: 'mcb:B', rating_a: '20', rcd_ma: '30', rcd_type: 'A' }, { rcd_1x_ms: '20', rcd_5x_ms: '10', rcd_button: 'ok' }));
    expect(rccb.basis).toContain('IEC 61008-1');
  });
  it('fails an over-range reading at or beyond the limit (it did not open in time)', () => {
    expect(trip('A', '>300', '20').status).toBe('fail');
    expect(trip('A', '>200', '20').status).toBe('not-verified'); // a bound below the limit proves nothing
  });
});

describe('RCD trip times, time-delayed type S (IEC 61008-1 / IEC 61009-1)', () => {
  it('opens between 130 and 500 ms at 1 × IΔn', () => {
    expect(trip('A-S', '500', '100').status).toBe('pass'); // IEC 61008-1: type S, IΔn, 130–500 ms
    expect(trip('A-S', '501', '100').status).toBe('fail');
    expect(trip('A-S', '130', '100').status).toBe('pass');
    expect(trip('A-S', '129', '100').status).toBe('attention'); // faster than the non-actuating time
  });
  it('opens between 50 and 150 ms at 5 × IΔn', () => {
    expect(trip('AC-S', '200', '150').status).toBe('pass'); // IEC 61008-1: type S, 5 IΔn, 50–150 ms
    expect(trip('AC-S', '200', '151').status).toBe('fail');
    expect(trip('AC-S', '200', '50').status).toBe('pass');
    expect(trip('AC-S', '200', '49').status).toBe('attention');
  });
  it('would fail a type S time against general-type limits', () => {
    expect(trip('A', '200', '100').status).toBe('fail'); // 100 ms at 5 × > 40 ms for a general type
  });
});

describe('RCD test button and missing readings', () => {
  it('fails a test button that did not trip', () => {
    expect(trip('A', '20', '10', 'fail').status).toBe('fail');
  });
  it('is not verified without either trip time or the button result', () => {
    const c = rcdCircuit('A');
    expect(rcd(context(c, { rcd_5x_ms: '10', rcd_button: 'ok' })).status).toBe('not-verified');
    expect(rcd(context(c, { rcd_1x_ms: '20', rcd_button: 'ok' })).status).toBe('not-verified');
    expect(rcd(context(c, { rcd_1x_ms: '20', rcd_5x_ms: '10' })).status).toBe('not-verified');
    expect(rcd(context(c, { rcd_1x_ms: 'not-tested', rcd_5x_ms: '10', rcd_button: 'ok' })).status).toBe('not-verified');
    expect(rcd(context(c, { rcd_1x_ms: '20', rcd_5x_ms: '10', rcd_button: 'n/a' })).status).toBe('not-verified');
  });
  it('is n/a, with the reason, on a circuit without an RCD', () => {
    const r = rcd(context({}, { rcd_1x_ms: 'n/a', rcd_button: 'not-tested' }));
    expect(r.status).toBe('n/a');
    expect(r.basis).toBe('no RCD on this circuit');
  });
  it('does not set aside RCD results recorded for a circuit that circuits.csv gives no RCD', () => {
    // 450 ms at 1 × IΔn is over the 300 ms of IEC 61008-1 / 61009-1 for a general-type RCD: it must
    // not vanish behind "no RCD"; without the RCD's rating it cannot be judged either
    const r = rcd(context({}, { rcd_1x_ms: '450', rcd_button: 'fail' }));
    expect(r.status).toBe('attention');
    expect(r.basis).toContain('1 × IΔn 450 ms on');
    expect(r.basis).toContain('test button fail on');
  });
});
