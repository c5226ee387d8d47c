/**
 * Every date Sixfold shows, formatted in one place in the reader's own locale: a list, a table
 * and an e-mail link all say the same thing the same way.
 */
const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });
const date = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });
const due = new Intl.DateTimeFormat(undefined, { weekday: 'short', day: 'numeric', month: 'short' });
// Days that the server counts in UTC (practice days, weeks) are shown as those same days.
const dayMonthUtc = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', timeZone: 'UTC' });
const longDayUtc = new Intl.DateTimeFormat(undefined, {
  weekday: 'long',
  day: 'numeric',
  month: 'long',
  timeZone: 'UTC',
});

type When = Date | string | number;
const asDate = (when: When) => (when instanceof Date ? when : new Date(when));

/** "2 Dec 2026, 17:40": when something happened. */
export const formatDateTime = (when: When) => dateTime.format(asDate(when));
/** "2 Dec 2026": a day. */
export const formatDate = (when: When) => date.format(asDate(when));
/** "Wed 2 Dec": a due date. */
export const formatDue = (when: When) => due.format(asDate(when));
/** "2 Dec": a day the server counted in UTC (a chart's axis). */
export const formatDayMonth = (when: When) => dayMonthUtc.format(asDate(when));
/** "Wednesday 2 December": a day the server counted in UTC, in full. */
export const formatLongDay = (when: When) => longDayUtc.format(asDate(when));
