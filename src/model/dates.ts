// Dates as packsmith keeps them: YYYY-MM-DD days (test sessions, issue dates), read as midnight
// UTC so a day is the same instant whatever the machine's time zone.

/** Midnight UTC of a YYYY-MM-DD date: a fixed instant, whatever the machine's time zone. */
export function dayOf(date: string): Date {
  const d = new Date(`${date}T00:00:00Z`);
  if (Number.isNaN(d.getTime())) throw new Error(`not a date: "${date}" (expected YYYY-MM-DD)`);
  return d;
}

/** A YYYY-MM-DD that is a real day. */
export function isIsoDay(s: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(s)) return false;
  try {
    return dayOf(s).toISOString().slice(0, 10) === s;
  } catch {
    return false;
  }
}
