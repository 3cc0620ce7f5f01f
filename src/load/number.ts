// The one grammar of a number in every job file, CSV cell or YAML value: an optional minus, digits,
// and an optional decimal point followed by digits. Not accepted: an exponent (1e-3, 6.90e-3: a
// spreadsheet's display format, one slip of a digit away from a factor of ten), a bare point
// (.690, 6.), a leading "+", hexadecimal, digit group separators, infinity or NaN.
export const PLAIN_NUMBER = /^-?\d+(?:\.\d+)?$/;

/** The number as text in the grammar above (never an exponent), for a YAML number handed on as text. */
export function plainText(n: number): string {
  const s = String(n);
  if (!/e/i.test(s)) return s;
  if (Math.abs(n) >= 1) return BigInt(Math.trunc(n)).toString();
  return n.toFixed(100).replace(/0+$/, '').replace(/\.$/, '');
}
