import { DateTime } from 'luxon';
import { coldProtocolPatterns, type ColdSchedule } from '../clinical/cold-schedule';
import type { ColdProtocol } from '../clinic/settings';
import { toMillis, type Instant } from '../clinical/instant';
import { escapeHtml, heading, list, mailDocument, mailStyles, paragraph } from '../mail/html';

/**
 * The athlete's home-care plan after a run: pure, so the e-mail and its calendar events can be checked
 * against the cold schedule without a server. Wording is our own; where it carries clinical advice the source
 * is named beside it (shared/notes/clinical-sources.md).
 */

export type HomeCareOutcome = 'completed' | 'fell-back' | 'stop-elevate-refer';

/** Cold at home: the rest of today's schedule, not at all (a contraindication), or not part of this phase's care. */
export type ColdAtHome = { kind: 'schedule'; schedule: ColdSchedule } | { kind: 'contraindicated' } | { kind: 'not-planned' };

export interface HomeCareInput {
  clinicName: string;
  athleteName: string;
  /** e.g. "anterior thigh (quadriceps), left" */
  injuryLabel: string;
  runId: string;
  runEndedAt: Instant;
  /** The clinic's IANA zone: every time in the message is local to it. */
  timeZone: string;
  outcome: HomeCareOutcome;
  cold: ColdAtHome;
  /** The compression wrap went home on the athlete (acute care, or back to cold). */
  wrap: boolean;
  /** The clinic wants to see the injury again within this many hours (remeasureAfterHours for the phase). */
  recheckWithinHours: number | null;
  /** The injury's booked re-check, when there is one after this run. */
  nextRecheckAt: Instant | null;
  /**
   * The athlete's single-use link to stop e-mails from the clinic (APP_URL/opt-out?token=…). Every message the
   * server sends carries one; it is the message's only link, and it opens a page of ours that tracks nothing.
   */
  optOutLink?: string | null;
}

/** One cold session as a calendar event. */
export interface ColdReminder {
  uid: string;
  startsAt: string;
  endsAt: string;
  minutes: number;
  title: string;
  description: string;
  /** The display alarm fires this long before the session (RFC 5545 VALARM, TRIGGER relative to DTSTART). */
  alarmMinutesBefore: number;
}

export interface HomeCareMessage {
  subject: string;
  text: string;
  html: string;
  /** One per cold session, in order; empty when no cold is scheduled (then no .ics goes with the message). */
  reminders: ColdReminder[];
}

export const coldReminderAlarmMinutes = 5;
export const coldRemindersFilename = 'cold-reminders.ics';

/**
 * When cold may start at home. Not before the run ends, and not before the protocol's rest after the run's last
 * cold application: an acute run ends with a 20-minute cold pack, and a home session straight after it would
 * make 40 minutes of continuous cold (decisions.md: never more than 20 without a supervisor's override).
 */
export function homeColdStart(input: { runEndedAt: Instant; lastColdEndedAt: Instant | null; protocol: ColdProtocol }): string {
  const pattern = coldProtocolPatterns[input.protocol];
  const last = pattern.applications[pattern.applications.length - 1];
  const restMinutes = pattern.everyMinutes - (last.offsetMinutes + last.minutes);
  const ended = toMillis(input.runEndedAt, 'runEndedAt');
  const afterRest = input.lastColdEndedAt === null ? ended : toMillis(input.lastColdEndedAt, 'lastColdEndedAt') + restMinutes * 60_000;
  return new Date(Math.max(ended, afterRest)).toISOString();
}

function local(instant: Instant, zone: string): DateTime {
  return DateTime.fromMillis(toMillis(instant), { zone }).setLocale('en-GB');
}

const clock = (dt: DateTime) => dt.toFormat('HH:mm');
const day = (dt: DateTime) => dt.toFormat('cccc d LLLL');

function firstName(name: string): string {
  return name.trim().split(/\s+/)[0] || name;
}

function recheckWords(hours: number): string {
  if (hours <= 24) return `within ${hours} hours`;
  const days = Math.round(hours / 24);
  return days === 7 ? 'within a week' : `within ${days} days`;
}

function reminderDescription(input: HomeCareInput, minutes: number): string {
  return (
    `Cold on your ${input.injuryLabel} for ${minutes} minutes. Wrap the ice or cold pack in a thin damp cloth; never put ice straight on the skin. ` +
    `Stop early if the skin turns white or blotchy, blisters, or stays numb. From ${input.clinicName}.`
  );
}

// Tintinalli's Emergency Medicine (chapter on compartment syndrome; edition not recorded): pain out of proportion,
// paraesthesia, a cold pale limb and tense, fast-increasing swelling mean urgent care.
export const urgentSigns = [
  'pain far worse than you would expect from the knock, or pain that keeps getting worse',
  'numbness, or pins and needles',
  'the limb below the injury is cold or pale',
  'swelling that feels tight (tense) and is increasing fast',
] as const;

// NHS inform (NHS Scotland), PRICE guidance for sprains and strains: wrap from the end furthest from the heart;
// loosen if pain increases or the area goes numb; no bandage in bed. The pad line is common practice.
export const wrapCare = [
  'If the wrap feels too tight, the pain increases or the area goes numb, loosen it at once.',
  'If the felt pad is uncomfortable, loosen the wrap or leave the pad out.',
  'If you put the wrap back on, start below the injury (the end furthest from your heart) and wind upwards in overlapping turns.',
  'Take the wrap off before you go to bed: no bandage in bed.',
] as const;

export const worseCare = [
  'Loosen the wrap and stop any cold session straight away.',
  'Rest, and keep the area raised on a pillow.',
  'If the pain eases and the feeling comes back soon after, carry on with the plan and tell us at your next visit.',
  'If the numbness or pins and needles stay once the wrap is loose, or the pain keeps rising, treat it as urgent (below).',
] as const;

export const adviceCaution =
  "This plan supports, and does not replace, your therapist's advice and a physician's advice. If anything here differs from what you were told in person, or you are unsure, ask us.";

export function buildHomeCareMessage(input: HomeCareInput): HomeCareMessage {
  const zone = input.timeZone;
  const ended = local(input.runEndedAt, zone);
  const sessions = input.cold.kind === 'schedule' ? input.cold.schedule.sessions : [];
  const reminders: ColdReminder[] = sessions.map((session, index) => ({
    uid: `${input.runId}-cold-${index + 1}@mendstep`,
    startsAt: session.startsAt,
    endsAt: session.endsAt,
    minutes: session.minutes,
    title: `Cold: ${session.minutes} minutes (${input.clinicName})`,
    description: reminderDescription(input, session.minutes),
    alarmMinutesBefore: coldReminderAlarmMinutes,
  }));

  const subject =
    input.outcome === 'stop-elevate-refer'
      ? `Please see a doctor today: your care until then, from ${input.clinicName}`
      : `Your home care plan for today, from ${input.clinicName}`;

  const intro = {
    completed: `Today's treatment of your ${input.injuryLabel} is done (finished at ${clock(ended)}). Here is how to look after it for the rest of the day.`,
    'fell-back': `During today's treatment of your ${input.injuryLabel} the swelling increased, so we went back to cold and compression. Please keep to this plan carefully for the rest of the day.`,
    'stop-elevate-refer': `During today's treatment of your ${input.injuryLabel} the swelling increased. Cold is not suitable for you, so we stopped, and your therapist advises you to see a doctor today. Until then, rest and keep the area raised.`,
  }[input.outcome];

  // Each section is written once as text lines and once as HTML, so both versions say the same things in order.
  const sections: { title: string; text: string[]; html: string }[] = [];

  if (input.cold.kind === 'schedule') {
    const schedule = input.cold.schedule;
    // Our words for the athlete (the schedule's own description speaks of rounds from the start of the hour).
    const rule =
      schedule.protocol === 'intermittent-10-10-10'
        ? '10 minutes of cold, 10 minutes off, then 10 more minutes of cold, every 2 hours while you are awake'
        : '20 minutes of cold in every hour while you are awake';
    if (sessions.length) {
      const rows = sessions.map((s) => {
        const from = local(s.startsAt, zone);
        const to = local(s.endsAt, zone);
        return { when: `${clock(from)} to ${clock(to)}`, what: `cold, ${s.minutes} minutes`, day: day(from) };
      });
      const howTo = [
        'Wrap the ice or cold pack in a thin, damp cloth; never put ice straight on the skin.',
        'Stop a session early if the skin turns white or blotchy, blisters, or stays numb or tingling afterwards.',
        'Keep the area raised on a pillow during each session.',
      ];
      const calendarLine = `The attached calendar file (${coldRemindersFilename}) puts these sessions in your calendar, each with a reminder ${coldReminderAlarmMinutes} minutes before.`;
      sections.push({
        title: `Cold for the rest of today (${rows[0].day})`,
        text: [
          `Today: ${rule}, at these times (local to the clinic, ${zone}).`,
          ...rows.map((r) => `  ${r.when}  ${r.what}`),
          '',
          ...howTo.map((l) => `- ${l}`),
          calendarLine,
        ],
        html:
          paragraph(`Today: ${rule}, at these times (local to the clinic, ${zone}).`) +
          `<table style="${mailStyles.table}"><thead><tr><th style="${mailStyles.cell}">Time</th><th style="${mailStyles.cell}">What</th></tr></thead><tbody>` +
          rows.map((r) => `<tr><td style="${mailStyles.cell}">${escapeHtml(r.when)}</td><td style="${mailStyles.cell}">${escapeHtml(r.what)}</td></tr>`).join('') +
          `</tbody></table>` +
          list(howTo) +
          paragraph(calendarLine),
      });
    } else {
      const line = 'It is too late today for another cold session within waking hours. Rest, and keep the area raised this evening.';
      sections.push({ title: 'Cold for the rest of today', text: [line], html: paragraph(line) });
    }
  } else if (input.cold.kind === 'contraindicated') {
    const line = "Do not use ice or cold packs: today's screening found a reason why cold is not safe for you.";
    sections.push({ title: 'No cold at home', text: [line], html: paragraph(line) });
  } else {
    const line = 'No cold at home is planned at this stage of healing. If the area swells or hurts more, contact us.';
    sections.push({ title: 'Cold at home', text: [line], html: paragraph(line) });
  }

  if (input.wrap) {
    const keep = input.cold.kind === 'schedule' && sessions.length ? 'Keep the compression wrap on between cold sessions today.' : 'Keep the compression wrap on today, as your therapist showed you.';
    const lines = [keep, ...wrapCare];
    sections.push({ title: 'Looking after the wrap', text: lines.map((l) => `- ${l}`), html: list(lines) });
  }

  sections.push({ title: 'If it hurts more or goes numb', text: worseCare.map((l) => `- ${l}`), html: list(worseCare) });

  const urgentLead = 'Get help now. Call us or a doctor straight away, or the emergency services if you cannot reach either, if you notice any of these:';
  const urgentTail = 'These can be signs of pressure building up inside the muscle, which needs treatment within hours.';

  const next = input.nextRecheckAt
    ? `Your next re-check: ${day(local(input.nextRecheckAt, zone))} at ${clock(local(input.nextRecheckAt, zone))}. If that time does not suit you, let us know.`
    : `We will contact you to arrange your next appointment.${
        input.recheckWithinHours ? ` We would like to check the injury again ${recheckWords(input.recheckWithinHours)}.` : ''
      }`;

  const greeting = `Hello ${firstName(input.athleteName)},`;
  const signOff = input.clinicName;
  const optOutLead = `You receive this e-mail because you were treated at ${input.clinicName}. To stop e-mails from ${input.clinicName}, open this link (no sign-in needed):`;

  const text = [
    greeting,
    '',
    intro,
    '',
    ...sections.flatMap((s) => [s.title.toUpperCase(), ...s.text, '']),
    'URGENT',
    urgentLead,
    ...urgentSigns.map((s) => `- ${s}`),
    urgentTail,
    '',
    'NEXT APPOINTMENT',
    next,
    '',
    adviceCaution,
    '',
    signOff,
    '',
    ...(input.optOutLink ? [optOutLead, input.optOutLink, ''] : []),
  ].join('\n');

  const html = mailDocument(
    subject,
    heading(`Home care from ${input.clinicName}`, 1) +
      paragraph(greeting) +
      paragraph(intro) +
      sections.map((s) => heading(s.title) + s.html).join('') +
      `<div role="alert" style="${mailStyles.urgent}"><p style="${mailStyles.p}"><strong>Urgent.</strong> ${escapeHtml(urgentLead)}</p>${list(urgentSigns)}<p style="margin:0;">${escapeHtml(
        urgentTail,
      )}</p></div>` +
      heading('Next appointment') +
      paragraph(next) +
      `<div style="${mailStyles.note}"><strong>Please note.</strong> ${escapeHtml(adviceCaution)}</div>` +
      paragraph(signOff) +
      (input.optOutLink
        ? `<p style="${mailStyles.small}">${escapeHtml(optOutLead)} <a href="${escapeHtml(input.optOutLink)}">Stop e-mails</a> (${escapeHtml(input.optOutLink)})</p>`
        : ''),
  );

  return { subject, text, html, reminders };
}
