import { z } from 'zod';
import { boundedText } from '../records/fields';

/** An athlete's data rights, handled by admins: an export of everything held, and erasure. */

export const dataRightsSearchSchema = z.object({
  q: boundedText('Search', 120).optional().describe("Part of the athlete's name"),
});
export type DataRightsSearch = z.infer<typeof dataRightsSearchSchema>;

export const eraseAthleteSchema = z.object({
  confirmName: boundedText('Confirmation', 120, 1).describe("The athlete's name, typed again to confirm"),
});
export type EraseAthleteInput = z.infer<typeof eraseAthleteSchema>;

export const confirmNameMismatch = "The name typed does not match this athlete's name.";

/** Typed names are compared without regard to case or repeated spaces: the check is for intent, not typing. */
export function sameName(typed: string, name: string): boolean {
  const norm = (s: string) => s.trim().replace(/\s+/g, ' ').toLocaleLowerCase('en');
  return norm(typed) === norm(name);
}

export interface DataRightsCounts {
  injuries: number;
  measurements: number;
  runs: number;
  sessionNotes: number;
  files: number;
  emails: number;
}

export interface DataRightsAthlete {
  id: string;
  name: string;
  yearOfBirth: number;
  erasedAt: string | null;
  emailOptedOutAt: string | null;
  counts: DataRightsCounts;
}

export interface ErasureResult {
  athlete: DataRightsAthlete;
  removed: { files: number; cancelledEmails: number; redactedEmails: number; mailboxCopies: number; optOutLinks: number };
  closedInjuries: number;
}

/** What erasure keeps and removes: shown on the confirmation screen and followed by the server (data-rights-service). */
export const erasureRemoves = [
  'Name (replaced by "Erased athlete" and a short number), e-mail address, position, notes and the guardian\'s name',
  'Free text about the athlete: how the injury happened, measurement notes, the session notes\' S, O, A and P text, sign-off comments, skip and end-early reasons, override and closing reasons (also in the audit trail)',
  'Uploaded files: bruise photos and signed consent forms, from storage and from the records',
  'E-mails about the athlete: queued ones are cancelled, sent ones lose their wording, copies in the local mailbox are deleted',
  'Who recorded consent and when (whether consent was given is kept as yes or no)',
] as const;

export const erasureKeeps = [
  'Year of birth and sport, for the clinic\'s figures',
  'Injuries (site, side, dates, phase), measurements (the numbers), runs with their plans and step logs, and the session notes\' status',
  'Whether consent to treatment and a guardian\'s consent were given (yes or no)',
  'The audit trail, with free text removed, and a record of this erasure: who, when, and what was removed',
] as const;

export const erasureConsequences = [
  'Open injuries are closed; no new injury, run, measurement, file, note or e-mail can be added for the athlete.',
  'Erasure cannot be undone. Export the athlete\'s data first if they asked for a copy.',
] as const;

/** The tables of an export, each as a CSV file under csv/ and as a list in athlete.json. */
export const exportTables = ['athlete', 'injuries', 'measurements', 'runs', 'run-log-entries', 'session-notes', 'uploads', 'emails', 'audit-events'] as const;
export type ExportTable = (typeof exportTables)[number];
