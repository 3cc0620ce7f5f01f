// The one reading of the clock: today's date on this machine's calendar, taken by the command
// line and passed in (as the default issue date, and the latest date a test session may carry).
export function today(now: Date = new Date()): string {
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}
