/**
 * How a revision's time reads on screen. One formatter for the process: building an
 * Intl.DateTimeFormat costs more than a page's own rendering.
 */
const REVISION_TIME = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

export function formatRevisionTime(at: Date): string {
  return REVISION_TIME.format(at);
}

const DAY = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

/** A date alone, as lists show when a page last changed. */
export function formatDay(at: Date): string {
  return DAY.format(at);
}
