/**
 * Column values as a raw read gives them, made what a model instance would hold: SQLite hands
 * dates and JSON columns back as text ("YYYY-MM-DD HH:MM:SS.SSS +00:00", JSON), PostgreSQL as
 * Date objects and parsed values.
 */

/** A DATE column's raw value as a Date. */
export function rawDate(d: Date | string): Date {
  if (d instanceof Date) return d;
  const iso = /^\d{4}-\d{2}-\d{2} /.test(d) ? d.replace(' ', 'T').replace(/ ([+-]\d{2}:\d{2})$/, '$1') : d;
  return new Date(iso);
}

/** A JSON column's raw value, parsed. */
export function rawJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T;
}
