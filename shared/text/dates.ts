/**
 * Dates as people read them in every country: the day, the month's name and the year, in UTC,
 * e.g. "2 Dec 2026" and "2 Dec 2026, 00:23 UTC". A numeric form such as 02/12/2026 means
 * different days in different countries, and a reader's locale must not change an audit record.
 */
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec']

function toDate(value: string | number | Date): Date | null {
  const date = value instanceof Date ? value : new Date(value)
  return Number.isNaN(date.getTime()) ? null : date
}

/** The day alone, in UTC; e.g. `formatDay('2026-12-02T00:23:00Z') === '2 Dec 2026'`; '—' for no date. */
export function formatDay(value: string | number | Date | null | undefined): string {
  const date = value === null || value === undefined ? null : toDate(value)
  if (!date) return '—'
  return `${date.getUTCDate()} ${MONTHS[date.getUTCMonth()]} ${date.getUTCFullYear()}`
}

/** The day and the time to the minute, in UTC; e.g. `formatMoment('2026-12-02T00:23:00Z') === '2 Dec 2026, 00:23 UTC'`. */
export function formatMoment(value: string | number | Date | null | undefined): string {
  const date = value === null || value === undefined ? null : toDate(value)
  if (!date) return '—'
  const pad = (n: number) => String(n).padStart(2, '0')
  return `${formatDay(date)}, ${pad(date.getUTCHours())}:${pad(date.getUTCMinutes())} UTC`
}
