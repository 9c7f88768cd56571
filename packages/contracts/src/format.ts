/**
 * Dates for people, one way everywhere (both apps, the PDFs, the mail): US
 * English, medium style ("Mar 14, 2026"). Built once, as Intl asks.
 */
const DATE = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium' });
const DATE_UTC = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeZone: 'UTC' });
const DATE_TIME = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

/**
 * A date as people read it. A calendar date without a time ("2026-03-14", as a
 * job's due date is stored) is that day wherever the reader is; an instant
 * (a Date, epoch ms or an ISO timestamp) is the reader's local day.
 *
 * @example formatDate('2026-03-14') // 'Mar 14, 2026'
 * @example formatDate(new Date(Date.UTC(2026, 2, 14, 12))) // 'Mar 14, 2026'
 */
export function formatDate(value: Date | string | number): string {
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value))
    return DATE_UTC.format(new Date(`${value}T00:00:00Z`));
  const d = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(d.getTime())) throw new RangeError(`cannot format ${String(value)} as a date`);
  return DATE.format(d);
}

/**
 * A date with its time, for timelines and comments.
 * @example formatDateTime('2026-03-14T15:30:00') // 'Mar 14, 2026, 3:30 PM'
 */
export function formatDateTime(value: Date | string | number): string {
  const d = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(d.getTime())) throw new RangeError(`cannot format ${String(value)} as a date`);
  return DATE_TIME.format(d);
}
