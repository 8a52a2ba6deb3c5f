import { z } from 'zod';

/** One zod schema per input, used by the note form and the server alike. */

export const maxNoteSectionLength = 8000;

const section = (label: string) =>
  z
    .string({ error: `${label} must be text` })
    .max(maxNoteSectionLength, `${label} must be at most ${maxNoteSectionLength} characters`);

/** A SOAP note: Subjective, Objective, Assessment, Plan. */
export const sessionNoteUpdateSchema = z.object({
  subjective: section('Subjective'),
  objective: section('Objective'),
  assessment: section('Assessment'),
  plan: section('Plan'),
});
export type SessionNoteUpdate = z.infer<typeof sessionNoteUpdateSchema>;

export const signOffSchema = z.object({
  comment: z
    .string({ error: 'Comment must be text' })
    .trim()
    .max(2000, 'Comment must be at most 2000 characters')
    .optional()
    .nullable(),
});
export type SignOff = z.infer<typeof signOffSchema>;

export const minReopenReasonLength = 5;

export const reopenSchema = z.object({
  reason: z
    .string({ error: `Give a reason of at least ${minReopenReasonLength} characters` })
    .trim()
    .min(minReopenReasonLength, `Give a reason of at least ${minReopenReasonLength} characters`)
    .max(500, 'Reason must be at most 500 characters'),
});
export type Reopen = z.infer<typeof reopenSchema>;

/** The sections a note needs before it can be submitted, with the words the form shows. */
export const noteSections = [
  { key: 'subjective', label: 'Subjective' },
  { key: 'objective', label: 'Objective' },
  { key: 'assessment', label: 'Assessment' },
  { key: 'plan', label: 'Plan' },
] as const;
