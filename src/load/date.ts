// Dates as job folders write them: YYYY-MM-DD, naming a day of the (Gregorian) calendar.

/**
 * Whether `s` is YYYY-MM-DD and names a real day: "2026-02-31" does not, though Date.parse reads
 * it (as 3 March). Years before 100 are refused too (Date.UTC reads them as 19xx).
 */
export function isCalendarDate(s: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(s);
  if (!m) return false;
  const [y, month, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const t = new Date(Date.UTC(y, month - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === month - 1 && t.getUTCDate() === d;
}
