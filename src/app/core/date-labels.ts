/*
 * Date wording for the guardian and admin screens, so a consent record, an invite expiry and
 * a mail's time read the same everywhere. Times show in the device's own time zone: a guardian
 * reads "when did I consent" in their local time, not the server's.
 */

const DATE_TIME = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
const DATE = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium' });

/** "3 Mar 2025, 18:40" for an ISO time; the raw text when it cannot be read as a date. */
export function dateTimeLabel(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : DATE_TIME.format(date);
}

/** "3 Mar 2025" for an ISO date or time. A bare YYYY-MM-DD is read as that calendar day. */
export function dateLabel(iso: string): string {
  const date = /^\d{4}-\d{2}-\d{2}$/.test(iso) ? new Date(`${iso}T12:00:00`) : new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : DATE.format(date);
}
