/**
 * How Throwline writes a moment for people, in one place so the read view, the history, the
 * editor and the outbox agree. The formatters are built once: Intl.DateTimeFormat is costly to
 * construct and these run for every row of a list.
 */

const DATE_TIME = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
const DATE = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const DAY_UTC = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' });
const DATE_TIME_UTC = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });
const DATE_TIME_SECONDS_UTC = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'medium', timeZone: 'UTC' });

/** A Date, an ISO 8601 string (as JSON carries dates) or milliseconds since 1970. */
export type Moment = Date | string | number;

const toDate = (when: Moment) => (when instanceof Date ? when : new Date(when));

/** "3 Dec 2026, 07:05": when a revision was saved, a draft kept, a message sent. */
export function formatDateTime(when: Moment): string {
  return DATE_TIME.format(toDate(when));
}

/** "3 Dec 2026": for lists where the day is enough. */
export function formatDate(when: Moment): string {
  return DATE.format(toDate(when));
}

/** "3 Dec 2026" as the day in UTC: for stamps the server stores as a day (checked on site). */
export function formatDayUtc(when: Moment): string {
  return DAY_UTC.format(toDate(when));
}

/** "3 Dec 2026, 07:05" in UTC, for server-rendered lists that say "UTC" after it. */
export function formatDateTimeUtc(when: Moment): string {
  return DATE_TIME_UTC.format(toDate(when));
}

/** "3 Dec 2026, 07:05:09" in UTC: the audit log, where the order within a minute matters. */
export function formatDateTimeSecondsUtc(when: Moment): string {
  return DATE_TIME_SECONDS_UTC.format(toDate(when));
}
