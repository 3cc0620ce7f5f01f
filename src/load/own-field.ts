// Records built from names a user's file gives (column headers): a name "__proto__" must become
// an own field of the record, as Object.fromEntries makes it, never the record's prototype.

/** record[key] = value, "__proto__" included as an own field. */
export function setOwn<T>(record: Record<string, T>, key: string, value: T): void {
  if (key === '__proto__') Object.defineProperty(record, key, { value, enumerable: true, writable: true, configurable: true });
  else record[key] = value;
}
