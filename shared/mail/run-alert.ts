import { DateTime } from 'luxon';
import { toMillis, type Instant } from '../clinical/instant';
import type { MailContent } from './outbox';
import { escapeHtml, heading, linkButton, list, mailDocument, paragraph } from './html';

export type RunAlertReason = 'fell-back' | 'stop-elevate-refer' | 'stopped-referred';

export interface RunAlertInput {
  clinicName: string;
  supervisorName: string;
  therapistName: string;
  athleteName: string;
  injuryLabel: string;
  phase: string;
  reason: RunAlertReason;
  /** Red flags as their labels, for a stop and refer. */
  redFlags: string[];
  /** The log's own words: "back to cold after ice massage", "swelling increased". */
  detail: string | null;
  /** True when the red flag came from the screening, before the run started. */
  atScreening: boolean;
  endedAt: Instant;
  timeZone: string;
  reviewUrl: string;
}

const headline: Record<RunAlertReason, string> = {
  'fell-back': 'Back to cold: swelling increased during a run',
  'stop-elevate-refer': 'Stop, elevate, refer: swelling increased and cold is not allowed',
  'stopped-referred': 'Stop and refer: a red flag',
};

/** The supervisor hears at once when a run went back to cold or stopped for a red flag, with a link to review it. */
export function buildRunAlert(input: RunAlertInput): MailContent {
  const when = DateTime.fromMillis(toMillis(input.endedAt), { zone: input.timeZone }).setLocale('en-GB').toFormat('cccc d LLLL, HH:mm');
  const title = headline[input.reason];
  const subject = `${title}: ${input.athleteName}`;
  const what =
    input.reason === 'stopped-referred'
      ? `${input.therapistName} stopped ${input.atScreening ? 'before the run, at screening,' : 'the run'} for ${input.athleteName} (${input.injuryLabel}, ${input.phase}) and referred the athlete to a physician.`
      : `${input.therapistName}'s run for ${input.athleteName} (${input.injuryLabel}, ${input.phase}) ended early: the swelling increased${
          input.reason === 'fell-back' ? ', so the athlete went back to cold and compression' : '; cold was contraindicated, so the run stopped with elevation and referral'
        }.`;
  const facts = [
    `When: ${when} (${input.timeZone})`,
    ...(input.redFlags.length ? [`Red flags: ${input.redFlags.join('; ')}`] : []),
    ...(input.detail ? [`Logged: ${input.detail}`] : []),
  ];
  const text = [
    `Hello ${input.supervisorName},`,
    '',
    what,
    '',
    ...facts.map((f) => `- ${f}`),
    '',
    `Review the run: ${input.reviewUrl}`,
    '',
    `${input.clinicName}, through Mendstep`,
    '',
  ].join('\n');
  const html = mailDocument(
    subject,
    heading(title, 1) +
      paragraph(`Hello ${input.supervisorName},`) +
      paragraph(what) +
      list(facts) +
      linkButton('Review the run', input.reviewUrl) +
      `<p>${escapeHtml(`${input.clinicName}, through Mendstep`)}</p>`,
  );
  return { subject, text, html };
}
