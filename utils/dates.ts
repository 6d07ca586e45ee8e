// Dates in the app: one unambiguous UTC form everywhere (see shared/text/dates.ts).
export { formatDay, formatMoment } from '#shared/text/dates'
