import { describe, expect, it } from 'vitest';
import { coldSchedule } from '../../../shared/clinical/cold-schedule';
import { coldRemindersIcs, homeCareProductId } from '../../../shared/home-care/cold-reminders-ics';
import { buildHomeCareMessage, homeColdStart, type HomeCareInput } from '../../../shared/home-care/home-care-message';
import { readIcs } from '../../support/smtp-ics';

const zone = 'Europe/London';
const waking = { start: '07:00', end: '22:00' };

function schedule(startIso: string, protocol: 'twenty-each-hour' | 'intermittent-10-10-10' = 'twenty-each-hour') {
  return coldSchedule({ start: startIso, timeZone: zone, wakingHours: waking, protocol });
}

function input(over: Partial<HomeCareInput> = {}): HomeCareInput {
  const start = '2026-06-10T09:40:00Z'; // 10:40 in London (BST)
  return {
    clinicName: 'Harbour Lane Treatment Room',
    athleteName: 'Rhiannon Vale',
    injuryLabel: 'anterior thigh (quadriceps), left',
    runId: '3f0c8a52-0000-4000-8000-000000000001',
    runEndedAt: '2026-06-10T09:10:00Z',
    timeZone: zone,
    outcome: 'completed',
    cold: { kind: 'schedule', schedule: schedule(start) },
    wrap: true,
    recheckWithinHours: 24,
    nextRecheckAt: null,
    ...over,
  };
}

describe('when cold may start at home', () => {
  it('waits the rest of the hour after the run’s last cold (20 minutes of each hour, common practice): 40 minutes', () => {
    const start = homeColdStart({ runEndedAt: '2026-06-10T09:10:00Z', lastColdEndedAt: '2026-06-10T09:00:00Z', protocol: 'twenty-each-hour' });
    expect(start).toBe('2026-06-10T09:40:00.000Z');
  });

  it('after the intermittent 10/10/10 round every 2 hours (Bleakley et al. 2006), waits the 90 minutes left of the 2 hours', () => {
    const start = homeColdStart({ runEndedAt: '2026-06-10T09:10:00Z', lastColdEndedAt: '2026-06-10T09:00:00Z', protocol: 'intermittent-10-10-10' });
    expect(start).toBe('2026-06-10T10:30:00.000Z');
  });

  it('never starts before the run has ended, and starts at its end when the run used no cold', () => {
    expect(homeColdStart({ runEndedAt: '2026-06-10T11:00:00Z', lastColdEndedAt: '2026-06-10T10:50:00Z', protocol: 'twenty-each-hour' })).toBe('2026-06-10T11:30:00.000Z');
    expect(homeColdStart({ runEndedAt: '2026-06-10T11:00:00Z', lastColdEndedAt: null, protocol: 'twenty-each-hour' })).toBe('2026-06-10T11:00:00.000Z');
  });
});

describe('the home-care message', () => {
  it('lists every remaining cold session at its local time, one reminder per session with the schedule’s times and lengths', () => {
    const plan = input();
    const expected = plan.cold.kind === 'schedule' ? plan.cold.schedule.sessions : [];
    const message = buildHomeCareMessage(plan);
    // 10:40 to 22:00 in 60-minute rounds: 10:40, 11:40, … 20:40 (21:40–22:00 ends exactly at 22:00, so it stays).
    expect(expected.map((s) => s.startsAt.slice(11, 16))).toEqual(['10:40', '11:40', '12:40', '13:40', '14:40', '15:40', '16:40', '17:40', '18:40', '19:40', '20:40', '21:40']);
    expect(message.reminders.map((r) => [r.startsAt, r.endsAt, r.minutes])).toEqual(expected.map((s) => [s.startsAt, s.endsAt, s.minutes]));
    expect(message.text).toContain('10:40 to 11:00  cold, 20 minutes');
    expect(message.text).toContain('21:40 to 22:00  cold, 20 minutes');
    expect(message.html).toContain('10:40 to 11:00');
    expect(new Set(message.reminders.map((r) => r.uid)).size).toBe(expected.length);
  });

  it('carries the NHS inform wrap care, what to do if it hurts more or goes numb, the urgent signs, the next appointment and the caution', () => {
    const { text, html, subject } = buildHomeCareMessage(input());
    expect(subject).toContain('Harbour Lane Treatment Room');
    // NHS inform (NHS Scotland), PRICE guidance: loosen if pain increases or numb; wrap from the end furthest from the heart; no bandage in bed.
    expect(text).toContain('If the wrap feels too tight, the pain increases or the area goes numb, loosen it at once.');
    expect(text).toContain('the end furthest from your heart');
    expect(text).toContain('no bandage in bed');
    expect(text).toContain('IF IT HURTS MORE OR GOES NUMB');
    // Tintinalli's Emergency Medicine, compartment syndrome: pain out of proportion, paraesthesia, cold pale limb, tense swelling.
    for (const sign of ['far worse than you would expect', 'pins and needles', 'cold or pale', 'tight (tense) and is increasing fast']) {
      expect(text).toContain(sign);
      expect(html).toContain(sign);
    }
    expect(text).toContain('Call us or a doctor straight away, or the emergency services');
    expect(text).toContain('We will contact you to arrange your next appointment. We would like to check the injury again within 24 hours.');
    expect(text).toContain("supports, and does not replace, your therapist's advice and a physician's advice");
    expect(html).toContain('supports, and does not replace, your therapist&#39;s advice');
  });

  it('has no tracking: no images, scripts, remote resources or links in the HTML', () => {
    const { html } = buildHomeCareMessage(input());
    expect(html).not.toMatch(/<img|<script|<link|<iframe|url\(|https?:\/\//i);
  });

  it('names a booked re-check in the clinic’s time instead of “we will contact you”', () => {
    const { text, html } = buildHomeCareMessage(input({ nextRecheckAt: '2026-06-11T08:30:00Z' }));
    expect(text).toContain('Your next re-check: Thursday 11 June at 09:30.');
    expect(html).toContain('Your next re-check: Thursday 11 June at 09:30.');
    expect(text).not.toContain('We will contact you');
  });

  it('escapes what people typed, so a name cannot inject HTML', () => {
    const { html } = buildHomeCareMessage(input({ athleteName: '<b>Rhiannon</b> Vale', clinicName: 'A & B <Clinic>' }));
    expect(html).toContain('&lt;b&gt;Rhiannon&lt;/b&gt;');
    expect(html).toContain('A &amp; B &lt;Clinic&gt;');
    expect(html).not.toContain('<b>Rhiannon');
  });

  it('says not to use cold, and schedules none, when cold is contraindicated or the run stopped to elevate and refer', () => {
    const message = buildHomeCareMessage(input({ outcome: 'stop-elevate-refer', cold: { kind: 'contraindicated' } }));
    expect(message.reminders).toEqual([]);
    expect(message.text).toContain('Do not use ice or cold packs');
    expect(message.text).toContain('see a doctor today');
    expect(message.text).toContain('Keep the compression wrap on today, as your therapist showed you.');
    expect(message.text).not.toContain('between cold sessions');
  });

  it('for the intermittent protocol (Bleakley et al. 2006: 10 on, 10 off, 10 on, every 2 hours) lists both applications of each round', () => {
    const intermittent = schedule('2026-06-10T09:40:00Z', 'intermittent-10-10-10');
    const message = buildHomeCareMessage(input({ cold: { kind: 'schedule', schedule: intermittent } }));
    expect(message.text).toContain('10 minutes of cold, 10 minutes off, then 10 more minutes of cold, every 2 hours');
    expect(message.text).toContain('10:40 to 10:50  cold, 10 minutes');
    expect(message.text).toContain('11:00 to 11:10  cold, 10 minutes');
    expect(message.text).toContain('12:40 to 12:50  cold, 10 minutes');
    expect(message.reminders.map((r) => r.minutes).every((m) => m === 10)).toBe(true);
    expect(message.reminders).toHaveLength(intermittent.sessions.length);
  });

  it('after a run that went back to cold, says so', () => {
    expect(buildHomeCareMessage(input({ outcome: 'fell-back' })).text).toContain('the swelling increased, so we went back to cold and compression');
  });

  it('when the run ends too late for another session before waking hours end, schedules nothing and says so', () => {
    const late = schedule('2026-06-10T20:50:00Z'); // 21:50 in London: 20 minutes would run past 22:00
    const message = buildHomeCareMessage(input({ cold: { kind: 'schedule', schedule: late } }));
    expect(late.sessions).toEqual([]);
    expect(message.reminders).toEqual([]);
    expect(message.text).toContain('too late today for another cold session');
  });
});

describe('the calendar file (RFC 5545, parsed with ical.js)', () => {
  const generatedAt = '2026-06-10T09:12:00Z';

  it('is a VCALENDAR with VERSION:2.0 and our PRODID (RFC 5545 §3.7.3, §3.7.4)', () => {
    const { reminders } = buildHomeCareMessage(input());
    const ics = readIcs(coldRemindersIcs(reminders, { generatedAt, calendarName: 'Cold reminders' }));
    expect(ics.name).toBe('vcalendar');
    expect(ics.version).toBe('2.0');
    expect(ics.prodid).toBe(homeCareProductId);
  });

  it('has one VEVENT per session, each with UID and DTSTAMP (RFC 5545 §3.6.1), DTSTART and a DURATION, at the schedule’s times', () => {
    const plan = input();
    const { reminders } = buildHomeCareMessage(plan);
    const sessions = plan.cold.kind === 'schedule' ? plan.cold.schedule.sessions : [];
    const { events } = readIcs(coldRemindersIcs(reminders, { generatedAt, calendarName: 'Cold reminders' }));
    expect(events).toHaveLength(sessions.length);
    events.forEach((event, i) => {
      expect(event.uid).not.toBe('');
      expect(event.dtstamp).toBeTruthy();
      expect(event.hasEndOrDuration).toBe(true);
      expect(event.start.toISOString()).toBe(new Date(sessions[i].startsAt).toISOString());
      expect(event.durationSeconds).toBe(sessions[i].minutes * 60);
    });
    expect(new Set(events.map((e) => e.uid)).size).toBe(events.length);
  });

  it('gives each event a DISPLAY alarm with a DESCRIPTION, 5 minutes before the session (RFC 5545 §3.6.6)', () => {
    const { reminders } = buildHomeCareMessage(input());
    const { events } = readIcs(coldRemindersIcs(reminders, { generatedAt, calendarName: 'Cold reminders' }));
    for (const event of events) {
      expect(event.alarms).toEqual([{ action: 'DISPLAY', trigger: '-PT5M', description: event.summary }]);
    }
  });

  it('keeps the schedule’s instants across the autumn clock change (Europe/London, 25 October 2026)', () => {
    // The clocks go back at 02:00 BST; waking hours 07:00–22:00 are then GMT (UTC+0).
    const autumn = schedule('2026-10-25T06:00:00Z');
    const { reminders } = buildHomeCareMessage(input({ cold: { kind: 'schedule', schedule: autumn }, runEndedAt: '2026-10-25T06:00:00Z' }));
    const { events } = readIcs(coldRemindersIcs(reminders, { generatedAt, calendarName: 'Cold reminders' }));
    expect(events[0].start.toISOString()).toBe('2026-10-25T07:00:00.000Z');
    expect(events.at(-1)!.start.toISOString()).toBe('2026-10-25T21:00:00.000Z');
  });

  it('refuses to make a calendar with no sessions', () => {
    expect(() => coldRemindersIcs([], { generatedAt, calendarName: 'x' })).toThrow(RangeError);
  });
});
