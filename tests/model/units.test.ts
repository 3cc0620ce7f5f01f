import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DECIMAL_COMMA, NUMBER, parseCell } from '../../src/model/units.js';
import { PLAIN_NUMBER } from '../../src/load/number.js';

const value = (text: string, q: Parameters<typeof parseCell>[1]) => {
  const r = parseCell(text, q);
  if (!r.ok) throw new Error(r.message);
  return r.reading;
};
const problem = (text: string, q: Parameters<typeof parseCell>[1]) => {
  const r = parseCell(text, q);
  if (r.ok) throw new Error(`expected an error for ${text}`);
  return r.message;
};

describe('cell values (CONTRACT.md value syntax)', () => {
  it('reads plain numbers and numbers with their unit', () => {
    expect(value('0.84', 'ohm')).toEqual({ kind: 'value', value: 0.84 });
    expect(value('0.84 Ω', 'ohm')).toEqual({ kind: 'value', value: 0.84 });
    expect(value('0.84ohm', 'ohm')).toEqual({ kind: 'value', value: 0.84 });
    expect(value('0.84 \u2126', 'ohm')).toEqual({ kind: 'value', value: 0.84 }); // the ohm sign, U+2126
    expect(value('250 MΩ', 'megohm')).toEqual({ kind: 'value', value: 250 });
    expect(value('28 ms', 'millisecond')).toEqual({ kind: 'value', value: 28 });
  });
  it('converts units of the same quantity to the field unit', () => {
    expect(value('840 mΩ', 'ohm')).toEqual({ kind: 'value', value: 0.84 });
    expect(value('1.2 GΩ', 'megohm')).toEqual({ kind: 'value', value: 1200 });
    expect(value('6000 A', 'kiloampere')).toEqual({ kind: 'value', value: 6 });
    expect(value('400 ms', 'second')).toEqual({ kind: 'value', value: 0.4 });
  });
  it('keeps m (milli) and M (mega) apart', () => {
    expect(value('2 mΩ', 'ohm')).toEqual({ kind: 'value', value: 0.002 });
    expect(problem('2 MΩ', 'ohm')).toMatch(/does not fit/);
  });
  it('reads over-range readings as lower bounds', () => {
    expect(value('>999', 'megohm')).toEqual({ kind: 'at-least', value: 999 });
    expect(value('> 299 MΩ', 'megohm')).toEqual({ kind: 'at-least', value: 299 });
  });
  it('reads n/a and not-tested', () => {
    expect(value('n/a', 'ohm')).toEqual({ kind: 'n/a' });
    expect(value('N/A', 'ohm')).toEqual({ kind: 'n/a' });
    expect(value('not-tested', 'ohm')).toEqual({ kind: 'not-tested' });
  });
  it('refuses a decimal comma, saying how to write it', () => {
    expect(problem('0,84', 'ohm')).toMatch(/decimal comma.*"0\.84"/);
    expect(problem('>0,5', 'megohm')).toMatch(/">0\.5"/);
  });
  it('refuses a unit of another quantity', () => {
    expect(problem('250 kV', 'megohm')).toMatch(/unit "kV" does not fit/);
    expect(problem('12 ft', 'metre')).toMatch(/unit "ft"/);
  });
  it('refuses negative resistances', () => {
    expect(problem('-0.2', 'ohm')).toMatch(/cannot be negative/);
  });
  it('refuses seconds where milliseconds are expected', () => {
    expect(problem('0.028 s', 'millisecond')).toMatch(/seconds.*write 28\b/);
    expect(problem('0.028', 'millisecond')).toMatch(/looks like seconds.*write 28\b/);
  });
  it('refuses words that are not values', () => {
    expect(problem('good', 'ohm')).toMatch(/expected a resistance in ohms/);
    expect(problem('1.5', 'count')).toMatch(/whole number/);
  });
});

describe('a plain number read without the looser patterns', () => {
  // parseCell takes a cell in the plain grammar as its own number part, without running NUMBER or
  // DECIMAL_COMMA: exact only while NUMBER splits such a cell into itself and nothing after it and
  // DECIMAL_COMMA refuses it. Should either pattern change, this fails.
  const digits = fc.stringMatching(/^\d{1,25}$/);
  const plain = fc.tuple(fc.boolean(), digits, fc.option(digits)).map(([minus, whole, frac]) => `${minus ? '-' : ''}${whole}${frac === null ? '' : `.${frac}`}`);
  const near = fc.stringMatching(/^[-+.,0-9eE ]{1,12}$/); // awkward neighbours of the grammar
  it('is split by NUMBER into itself and nothing, and is no decimal comma', () => {
    fc.assert(fc.property(fc.oneof(plain, near), (text) => {
      if (!PLAIN_NUMBER.test(text)) return;
      expect([...(NUMBER.exec(text) ?? [])]).toEqual([text, text, '']);
      expect(DECIMAL_COMMA.test(text)).toBe(false);
    }), { numRuns: 5000 });
  });
});
