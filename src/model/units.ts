// Parsing of the values written in job files: a number with an optional unit ("0.84",
// "0.84 Ω", "250 MΩ"), an over-range reading (">999"), "n/a" or "not-tested".
//
// Every field has a quantity; its value is stored in the unit its name says (`zs_ohm` in ohms,
// `ir_le_mohm` in megohms, `rcd_1x_ms` in milliseconds). A unit written in the cell is
// converted to that unit; a unit of another quantity is an error, never a guess.

import { PLAIN_NUMBER, plainText } from '../load/number.js';

export type Quantity =
  | 'ohm'
  | 'megohm'
  | 'volt'
  | 'ampere'
  | 'milliampere'
  | 'kiloampere'
  | 'millisecond'
  | 'second'
  | 'mm2'
  | 'metre'
  | 'millimetre'
  | 'ampere2second'
  | 'celsius'
  | 'count';

/** A parsed cell. `at-least` is an instrument's over-range reading: a lower bound. */
export type Reading =
  | { kind: 'value'; value: number }
  | { kind: 'at-least'; value: number }
  | { kind: 'n/a' }
  | { kind: 'not-tested' };

interface QuantityInfo {
  /** how the quantity is named in messages */
  words: string;
  /** the unit symbol shown after a value */
  symbol: string;
  /** accepted unit spellings (lower case, no spaces) and the factor to the field's unit */
  units: Record<string, number>;
  /** a negative value is impossible */
  nonNegative: boolean;
}

const OHM = 'Ω';

/** Spellings of "<prefix>ohm" (case matters for the prefix: m is milli, M is mega). */
function ohms(prefix: string, factor: number): Record<string, number> {
  const words = ['Ω', '\u2126', 'ohm', 'ohms', 'Ohm', 'Ohms', 'OHM'];
  return Object.fromEntries(words.map((w) => [`${prefix}${w}`, factor]));
}

export const QUANTITIES: Record<Quantity, QuantityInfo> = {
  ohm: {
    words: 'a resistance in ohms',
    symbol: OHM,
    units: { ...ohms('', 1), ...ohms('m', 0.001), ...ohms('k', 1000) },
    nonNegative: true,
  },
  megohm: {
    words: 'an insulation resistance in megohms',
    symbol: 'MΩ',
    units: { ...ohms('M', 1), ...ohms('meg', 1), ...ohms('mega', 1), ...ohms('G', 1000), ...ohms('k', 0.001) },
    nonNegative: true,
  },
  volt: { words: 'a voltage in volts', symbol: 'V', units: { V: 1, v: 1, kV: 1000 }, nonNegative: true },
  ampere: { words: 'a current in amperes', symbol: 'A', units: { A: 1, a: 1, kA: 1000, mA: 0.001 }, nonNegative: true },
  milliampere: { words: 'a current in milliamperes', symbol: 'mA', units: { mA: 1, ma: 1, A: 1000 }, nonNegative: true },
  kiloampere: { words: 'a current in kiloamperes', symbol: 'kA', units: { kA: 1, ka: 1, KA: 1, A: 0.001 }, nonNegative: true },
  // A seconds unit in a milliseconds field is refused (see parseCell): a slip of a factor 1000.
  millisecond: { words: 'a time in milliseconds', symbol: 'ms', units: { ms: 1 }, nonNegative: true },
  second: { words: 'a time in seconds', symbol: 's', units: { s: 1, ms: 0.001 }, nonNegative: true },
  mm2: { words: 'a cross-section in mm²', symbol: 'mm²', units: { 'mm²': 1, mm2: 1 }, nonNegative: true },
  // A field's unit is the one its name says (length_m in metres, insulation_mm in millimetres); a
  // length written in another unit of length is converted, so "0.6 m" in a _mm field is 600 mm.
  metre: { words: 'a length in metres', symbol: 'm', units: { m: 1, mm: 0.001, cm: 0.01, km: 1000 }, nonNegative: true },
  millimetre: { words: 'a length in millimetres', symbol: 'mm', units: { mm: 1, cm: 10, m: 1000 }, nonNegative: true },
  ampere2second: {
    words: 'an energy (let-through I²t) in A²s',
    symbol: 'A²s',
    units: { 'A²s': 1, A2s: 1, 'a²s': 1, a2s: 1, 'kA²s': 1e6, kA2s: 1e6, 'ka²s': 1e6, ka2s: 1e6 },
    nonNegative: true,
  },
  celsius: { words: 'a temperature in °C', symbol: '°C', units: { '°C': 1, C: 1, degC: 1 }, nonNegative: false },
  count: { words: 'a whole number', symbol: '', units: {}, nonNegative: true },
};

export type CellResult = { ok: true; reading: Reading } | { ok: false; message: string };

// The number grammar (load/number.ts) is strict; this looser pattern only finds what was meant
// by a number it refuses (1e-3, .690, 6., +5), to say what to write instead.
export const NUMBER = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?)\s*(.*)$/i;
export const DECIMAL_COMMA = /^[+-]?\d+,\d+\s*\S*$/;

/**
 * Parse one cell of the given quantity. An empty cell is the caller's business (not given).
 * `columnUnit` is the unit a column's header names (an instrument export's "Zs (Ω)"): a number
 * written without a unit is in it. Check it first with `unitFits`.
 */
export function parseCell(text: string, quantity: Quantity, columnUnit = ''): CellResult {
  const info = QUANTITIES[quantity];
  const raw = text.trim();
  const lower = raw.toLowerCase();
  if (lower === 'n/a' || lower === 'na') return { ok: true, reading: { kind: 'n/a' } };
  if (lower === 'not-tested' || lower === 'not tested' || lower === 'nt') {
    return { ok: true, reading: { kind: 'not-tested' } };
  }
  const bound = raw.startsWith('>');
  const body = bound ? raw.slice(1).trim() : raw;
  // A plain number, the usual cell, is its own number part: NUMBER would give [body, body, ''] and
  // DECIMAL_COMMA nothing (tests/model/units.test.ts holds them to that), so neither is run.
  const plain = PLAIN_NUMBER.test(body);
  if (!plain && DECIMAL_COMMA.test(body)) {
    const fixed = body.replace(',', '.');
    return { ok: false, message: `found "${raw}" with a decimal comma; write a decimal point, e.g. "${bound ? '>' : ''}${fixed}"` };
  }
  const m = plain ? [body, body, ''] : NUMBER.exec(body);
  if (!m) {
    return {
      ok: false,
      message: `found "${raw}"; expected ${info.words} (e.g. "${example(quantity)}"), ">N" for an over-range reading, "n/a" or "not-tested"`,
    };
  }
  let value = Number(m[1]);
  if (!plain && !PLAIN_NUMBER.test(m[1]!)) {
    const instead = Number.isFinite(value) && value !== 0 && Math.abs(value) < 1e12 && Math.abs(value) > 1e-9 ? plainText(value) : null;
    return { ok: false, message: `found "${raw}"; write the number as a plain decimal${instead !== null ? `, e.g. "${bound ? '>' : ''}${instead}${m[2] ? ` ${m[2]}` : ''}"` : ''} (no exponent, no point without digits on both sides, no "+")` };
  }
  if (!Number.isFinite(value)) return { ok: false, message: `found "${raw}"; the number is too large for any reading` };
  const negative = m[1]!.startsWith('-');
  const after = m[2] ?? '';
  const written = after === '' ? '' : after.replace(/\s+/g, '');
  const unit = written !== '' ? written : columnUnit === '' ? '' : columnUnit.replace(/\s+/g, '');
  if (unit !== '') {
    if (quantity === 'millisecond' && (unit === 's' || unit === 'sec')) {
      return { ok: false, message: `found "${raw}", a time in seconds; this column is in milliseconds (write ${fmt(value * 1000)})` };
    }
    const factor = info.units[unit];
    if (factor === undefined) {
      return { ok: false, message: `found "${raw}": the unit "${written === '' ? columnUnit : m[2]}" does not fit here; expected ${info.words}` };
    }
    value *= factor;
  }
  if (quantity === 'millisecond' && written === '' && value > 0 && value < 1) {
    return { ok: false, message: `found "${raw}", which looks like seconds; this column is in milliseconds (write ${fmt(value * 1000)})` };
  }
  if (info.nonNegative && (value < 0 || negative)) {
    return { ok: false, message: `found "${raw}"; ${info.words.replace(/^an? /, 'a ')} cannot be negative` };
  }
  if (quantity === 'count' && !Number.isInteger(value)) {
    return { ok: false, message: `found "${raw}"; expected a whole number` };
  }
  return { ok: true, reading: bound ? { kind: 'at-least', value } : { kind: 'value', value } };
}

function example(q: Quantity): string {
  const samples: Record<Quantity, string> = {
    ohm: '0.84', megohm: '250', volt: '500', ampere: '32', milliampere: '30', kiloampere: '6',
    millisecond: '28', second: '0.4', mm2: '2.5', metre: '18', millimetre: '100', ampere2second: '18000',
    celsius: '30', count: '1',
  };
  return samples[q];
}

/** fmt's texts at 3 significant digits, by number (a Map's keys: +0 and -0 are one key, as fmt writes both "0"). */
const WRITTEN3 = new Map<number, string>();
const WRITTEN3_MAX = 8192;

/** A number for messages and tables: `sig` significant digits, whole numbers kept whole. */
export function fmt(n: number, sig = 3): string {
  if (sig !== 3) return written(n, sig);
  // A pack writes some 3,500 numbers, most of them a few dozen values over and over (0.4 s, 32 A,
  // 230 V, a circuit's max Zs in each of its lines): each is written once and looked up after.
  // Bounded, so a long run over many jobs holds under a megabyte of them.
  let text = WRITTEN3.get(n);
  if (text === undefined) {
    if (WRITTEN3.size >= WRITTEN3_MAX) WRITTEN3.clear();
    text = written(n, 3);
    WRITTEN3.set(n, text);
  }
  return text;
}

function written(n: number, sig: number): string {
  if (!Number.isFinite(n)) return String(n);
  if (Math.abs(n) >= 10 ** sig) return String(Math.round(n));
  return String(toSignificant(n, sig));
}

/** 10^i for i = 0…22, each exact (5^22 < 2^53), built by multiplication so no library rounding enters. */
const POW10: readonly number[] = Array.from({ length: 23 }).reduce<number[]>((p, _, i) => [...p, i === 0 ? 1 : p[i - 1]! * 10], []);

/**
 * Number(n.toPrecision(sig)), the same double, without formatting and parsing a string (basis
 * lines call it thousands of times per job). n is scaled to `sig` digits before the point by an
 * exact power of ten, rounded half up on its magnitude (as toPrecision rounds), and scaled back
 * by one correctly rounded operation of two exact numbers, which gives the double nearest the
 * decimal, as parsing does. The one scaling product or quotient may be off by half an ulp: where
 * that could move the rounding (a fraction within 1e-9 of one half) or the power of ten is not
 * exact, toPrecision itself answers.
 */
export function toSignificant(n: number, sig = 3): number {
  const a = Math.abs(n);
  if (a === 0 || !Number.isFinite(a) || sig < 1 || sig > 6) return Number(n.toPrecision(sig));
  let k = sig - 1 - Math.floor(Math.log10(a));
  for (let tries = 0; tries < 2; tries++) {
    if (k > 22 || k < -22) break;
    const scaled = k >= 0 ? a * POW10[k]! : a / POW10[-k]!;
    // log10 may be one out near a power of ten: the scaled value must have `sig` digits before the point
    if (scaled < POW10[sig - 1]!) { k++; continue; }
    if (scaled >= POW10[sig]!) { k--; continue; }
    const frac = scaled - Math.floor(scaled);
    if (Math.abs(frac - 0.5) < 1e-9) break;
    const digits = Math.floor(scaled) + (frac > 0.5 ? 1 : 0);
    const m = k >= 0 ? digits / POW10[k]! : digits * POW10[-k]!;
    return n < 0 ? -m : m;
  }
  return Number(n.toPrecision(sig));
}

/**
 * Number(n.toFixed(places)), the same double, without formatting and parsing a string: the design
 * and check values are rounded so thousands of times per job (toFixed and the parse cost some
 * 150 ns; this, a few). toFixed takes the whole number d nearest to n × 10^places, the larger of
 * two equally near. Here n × 10^places is one correctly rounded product p. Below 2^52 every
 * k + 1/2 is a double, and rounding keeps order, so p is above k + 1/2 only where the exact product
 * is, and below it only where it is: d is read off p, except where p is k + 1/2 itself (the exact
 * product may be just either side), where toFixed answers, as it does for 0, NaN, the infinities,
 * more than 6 places and products of 2^52 or more. d / 10^places, one correctly rounded quotient
 * of two exact numbers, is the double nearest the decimal, as the parse gives.
 */
export function toPlaces(n: number, places: number): number {
  if (n < 0) return -toPlaces(-n, places); // toFixed writes the sign, then the digits of -n
  if (!(n > 0) || places < 0 || places > 6 || !Number.isInteger(places)) return Number(n.toFixed(places));
  const scale = POW10[places]!;
  const scaled = n * scale;
  if (!(scaled < 2 ** 52)) return Number(n.toFixed(places));
  const whole = Math.floor(scaled);
  const frac = scaled - whole; // exact below 2^52
  if (frac === 0.5) return Number(n.toFixed(places));
  return (frac > 0.5 ? whole + 1 : whole) / scale;
}

/** toPlaces, with null (a value not known) kept null. */
export const toPlacesOrNull = (n: number | null, places: number): number | null => (n === null ? null : toPlaces(n, places));

/** Whether a unit (as written in a column header) is one of the quantity's. */
export function unitFits(unit: string, q: Quantity): boolean {
  return QUANTITIES[q].units[unit.replace(/\s+/g, '')] !== undefined;
}

/** A number kept to `sig` significant digits, for derived values in JSON (317 A, 0.0253 s). */
export const significant = (n: number, sig = 3): number => toSignificant(n, sig);

export function symbolOf(q: Quantity): string {
  return QUANTITIES[q].symbol;
}
