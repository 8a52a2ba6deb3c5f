import ICAL from 'ical.js';

export interface IcsEvent {
  uid: string;
  dtstamp: unknown;
  start: Date;
  durationSeconds: number;
  hasEndOrDuration: boolean;
  summary: string;
  alarms: { action: string; trigger: string; description: string }[];
}

/** Parses an iCalendar file with ical.js, the reference parser, and reads what RFC 5545 requires of it. */
export function readIcs(source: string) {
  const calendar = new ICAL.Component(ICAL.parse(source));
  const events: IcsEvent[] = calendar.getAllSubcomponents('vevent').map((component) => {
    const event = new ICAL.Event(component);
    return {
      uid: String(component.getFirstPropertyValue('uid') ?? ''),
      dtstamp: component.getFirstPropertyValue('dtstamp'),
      start: event.startDate.toJSDate(),
      durationSeconds: event.duration.toSeconds(),
      hasEndOrDuration: component.hasProperty('dtend') || component.hasProperty('duration'),
      summary: String(component.getFirstPropertyValue('summary') ?? ''),
      alarms: component.getAllSubcomponents('valarm').map((alarm) => ({
        action: String(alarm.getFirstPropertyValue('action') ?? ''),
        trigger: String(alarm.getFirstPropertyValue('trigger') ?? ''),
        description: String(alarm.getFirstPropertyValue('description') ?? ''),
      })),
    };
  });
  return {
    name: calendar.name,
    version: calendar.getFirstPropertyValue('version'),
    prodid: calendar.getFirstPropertyValue('prodid'),
    events,
  };
}
