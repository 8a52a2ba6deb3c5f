/**
 * Times on screen are the tablet's local time; the tablet sits in the clinic. Cold sessions are the
 * exception: the server writes them in the clinic's zone with its offset, so their clock reads off the string.
 */

const pad = (n: number) => String(Math.trunc(Math.abs(n))).padStart(2, '0');

/** The value a `datetime-local` input expects, in this device's zone, to the minute. */
export function toLocalInputValue(date: Date): string {
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

/**
 * A `datetime-local` value as an ISO instant with this device's offset, so the server stores the instant the
 * therapist meant. Unparseable input is passed through for the schema to reject with its own message.
 */
export function localInputToIso(value: string): string | undefined {
  if (!value) return undefined;
  const date = new Date(value);
  if (Number.isNaN(date.getTime())) return value;
  const offset = -date.getTimezoneOffset();
  const sign = offset >= 0 ? '+' : '-';
  return `${toLocalInputValue(date)}:00${sign}${pad(offset / 60)}:${pad(offset % 60)}`;
}

const dateTime = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
const shortDate = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

export const formatDateTime = (iso: string) => dateTime.format(new Date(iso));
export const formatShortDateTime = (iso: string | number) => shortDate.format(new Date(iso));

/** "14:20" from "2026-03-30T14:20:00+01:00": the clinic's own clock, whatever zone the tablet is set to. */
export const clockFromIso = (iso: string) => iso.slice(11, 16);

/** "3 h ago", "2 days ago": how fresh a measurement is, at a glance. */
export function timeAgo(iso: string, now = Date.now()): string {
  const minutes = Math.max(0, Math.round((now - Date.parse(iso)) / 60_000));
  if (minutes < 60) return minutes <= 1 ? 'just now' : `${minutes} min ago`;
  const hours = Math.round(minutes / 60);
  if (hours < 48) return `${hours} h ago`;
  return `${Math.round(hours / 24)} days ago`;
}
