import { DateTime } from 'luxon';
import type { Role } from '../auth/roles';
import { toMillis, type Instant } from '../clinical/instant';
import type { MailContent } from './outbox';
import { heading, linkButton, mailDocument, paragraph } from './html';

const roleWords: Record<Role, string> = { therapist: 'a therapist', supervisor: 'a supervisor', admin: 'an admin' };

function expiry(at: Instant, zone: string): string {
  return DateTime.fromMillis(toMillis(at), { zone }).setLocale('en-GB').toFormat("cccc d LLLL 'at' HH:mm");
}

export interface InvitationMailInput {
  clinicName: string;
  inviteeName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Instant;
  timeZone: string;
}

export function buildInvitationMail(input: InvitationMailInput): MailContent {
  const subject = `You are invited to ${input.clinicName} on Mendstep`;
  const lines = [
    `${input.inviterName} has invited you to join ${input.clinicName} on Mendstep as ${roleWords[input.role]}.`,
    'Choose your password with the link below. It works once, and until ' + `${expiry(input.expiresAt, input.timeZone)} (${input.timeZone} time).`,
    'If you did not expect this invitation, ignore this message: no account is opened until a password is set.',
  ];
  return {
    subject,
    text: [`Hello ${input.inviteeName},`, '', lines[0], '', `Set your password: ${input.link}`, '', lines[1], lines[2], ''].join('\n'),
    html: mailDocument(
      subject,
      heading('Welcome to Mendstep', 1) + paragraph(`Hello ${input.inviteeName},`) + paragraph(lines[0]) + linkButton('Set your password', input.link) + paragraph(lines[1]) + paragraph(lines[2]),
    ),
  };
}

export interface PasswordResetMailInput {
  clinicName: string;
  name: string;
  link: string;
  expiresAt: Instant;
  timeZone: string;
}

export function buildPasswordResetMail(input: PasswordResetMailInput): MailContent {
  const subject = 'Reset your Mendstep password';
  const lines = [
    `Someone (we hope you) asked to reset the password of your ${input.clinicName} account on Mendstep.`,
    `The link works once, and until ${expiry(input.expiresAt, input.timeZone)} (${input.timeZone} time). Setting a new password signs you out everywhere else.`,
    'If you did not ask for this, ignore this message: your password stays as it is.',
  ];
  return {
    subject,
    text: [`Hello ${input.name},`, '', lines[0], '', `Choose a new password: ${input.link}`, '', lines[1], lines[2], ''].join('\n'),
    html: mailDocument(
      subject,
      heading('Reset your password', 1) + paragraph(`Hello ${input.name},`) + paragraph(lines[0]) + linkButton('Choose a new password', input.link) + paragraph(lines[1]) + paragraph(lines[2]),
    ),
  };
}
