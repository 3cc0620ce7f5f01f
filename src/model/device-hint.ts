// The usual ways people write a protective device ("B32", "MCB B 32", "C16 RCBO", "30A rewireable",
// "BS88 63A") turned into a hint at packsmith's device code and rating, for the input error of a
// device that is not one of the codes. A hint only: the value is still refused, never guessed.
import type { DeviceCode } from '../reference/device-codes.js';

export interface DeviceGuess {
  /** one code, or several when the writing leaves the choice open (MCB without a curve) */
  codes: DeviceCode[];
  rating: number | null;
}

const FUSES: [RegExp, DeviceCode][] = [
  [/BS\s*-?\s*3036|REWIR|SEMI[\s-]*ENCLOSED/, 'fuse:bs3036'],
  [/BS\s*-?\s*88\s*-?\s*3|BS\s*-?\s*1361|CARTRIDGE/, 'fuse:bs88-3'],
  [/BS\s*-?\s*88|\bG\s*G\b|GG|HRC|60269/, 'fuse:gG'],
];

export function guessDevice(written: string): DeviceGuess | null {
  let s = written.toUpperCase();
  let fuse: DeviceCode | null = null;
  for (const [re, code] of FUSES) {
    if (re.test(s)) {
      fuse = code;
      s = s.replace(re, ' ');
      break;
    }
  }
  const tokens = s.replace(/([A-Z])(\d)/g, '$1 $2').replace(/(\d)([A-Z])/g, '$1 $2').split(/[^A-Z0-9.]+/).filter(Boolean);
  const number = tokens.find((t) => /^\d+(?:\.\d+)?$/.test(t));
  const rating = number === undefined ? null : Number(number);
  if (fuse) return { codes: [fuse], rating };
  const family = tokens.includes('RCBO') ? 'rcbo' : tokens.some((t) => ['MCB', 'MCCB', 'CB', 'BREAKER'].includes(t)) ? 'mcb' : null;
  const curve = tokens.find((t) => t === 'B' || t === 'C' || t === 'D') as 'B' | 'C' | 'D' | undefined;
  if (curve) return { codes: [`${family ?? 'mcb'}:${curve}` as DeviceCode], rating };
  if (family) return { codes: (['B', 'C', 'D'] as const).map((c) => `${family}:${c}` as DeviceCode), rating };
  return null;
}

/** "; did you mean device mcb:B, rating_a 32?" or '' when the writing is not recognised. */
export function deviceHint(written: string): string {
  const g = guessDevice(written);
  if (!g) return '';
  const codes = g.codes.length === 1 ? g.codes[0]! : `${g.codes.slice(0, -1).join(', ')} or ${g.codes.at(-1)} (the curve letter printed on the device)`;
  return `; did you mean device ${codes}${g.rating === null ? '' : `, rating_a ${g.rating}`}? (the rating goes in its own column, rating_a)`;
}
