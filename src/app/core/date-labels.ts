/*
 * Date wording for the guardian and admin screens, so a consent record, an invite expiry and
 * a mail's time read the same everywhere. Times show in the device's own time zone: a guardian
 * reads "when did I consent" in their local time, not the server's. The words follow the club's
 * locale: `ClubFormat` sets it here, and because it is a signal, templates and `computed()` that
 * call these functions follow a change.
 */
import { signal } from '@angular/core';
import { DEFAULT_LOCALE } from '../../../shared/quantity-format';

const locale = signal(DEFAULT_LOCALE);
const formats = new Map<string, Intl.DateTimeFormat>();

function format(options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${locale()}|${JSON.stringify(options)}`;
  let f = formats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale(), options);
    formats.set(key, f);
  }
  return f;
}

/** Sets the locale the labels use (the club's; called by `ClubFormat`). */
export function setDateLabelLocale(tag: string): void {
  locale.set(tag);
}

/** "3 Mar 2025, 18:40" for an ISO time; the raw text when it cannot be read as a date. */
export function dateTimeLabel(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : format({ dateStyle: 'medium', timeStyle: 'short' }).format(date);
}

/** "3 Mar 2025" for an ISO date or time. A bare YYYY-MM-DD is read as that calendar day. */
export function dateLabel(iso: string): string {
  const date = /^\d{4}-\d{2}-\d{2}$/.test(iso) ? new Date(`${iso}T12:00:00`) : new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : format({ dateStyle: 'medium' }).format(date);
}
