import { createEvents, type EventAttributes } from 'ics';
import { toMillis, type Instant } from '../clinical/instant';
import type { ColdReminder } from './home-care-message';

export const homeCareProductId = '-//Mendstep//Home care reminders//EN';

/**
 * The cold sessions as an iCalendar file (RFC 5545): one VEVENT per session, in UTC so no VTIMEZONE is needed,
 * each with a display VALARM before it. DTSTAMP is when the plan was made, so the same plan gives the same file.
 */
export function coldRemindersIcs(reminders: readonly ColdReminder[], options: { generatedAt: Instant; calendarName: string }): string {
  if (!reminders.length) throw new RangeError('No cold sessions to put in a calendar');
  const stamp = toMillis(options.generatedAt, 'generatedAt');
  const events = reminders.map(
    (r): EventAttributes & { timestamp: number } => ({
      uid: r.uid,
      timestamp: stamp,
      start: toMillis(r.startsAt, 'startsAt'),
      startInputType: 'utc',
      startOutputType: 'utc',
      duration: { minutes: r.minutes },
      title: r.title,
      description: r.description,
      status: 'CONFIRMED',
      // The athlete's day is not blocked by a cold pack on the sofa.
      busyStatus: 'FREE',
      transp: 'TRANSPARENT',
      alarms: [{ action: 'display', description: r.title, trigger: { minutes: r.alarmMinutesBefore, before: true } }],
    }),
  );
  const { error, value } = createEvents(events, { productId: homeCareProductId, method: 'PUBLISH', calName: options.calendarName });
  if (error || !value) throw error ?? new Error('The calendar file could not be made');
  return value;
}
