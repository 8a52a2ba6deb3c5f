import { z } from 'zod';
import { stepKindSchema } from '../plan/step-kinds';
import { isoInstant, safeText } from '../records/fields';

/** One line of a run's log, as table mode sends it and the review desk reads it. */

export const logEntryTypes = [
  'step-completed',
  'step-skipped',
  'step-interrupted',
  'swelling-check',
  'paused',
  'resumed',
  'red-flag',
  'run-completed',
  'run-fell-back',
  'run-ended-early',
  'extended',
] as const;
export const logEntryTypeSchema = z.enum(logEntryTypes, { error: `Type must be one of: ${logEntryTypes.join(', ')}` });
export type LogEntryType = z.infer<typeof logEntryTypeSchema>;

const stepTypes: readonly LogEntryType[] = ['step-completed', 'step-skipped', 'step-interrupted', 'extended'];
// Skips, red flags and early ends are the entries a supervisor questions; without a reason they say nothing.
const reasonRequired: readonly LogEntryType[] = ['step-skipped', 'red-flag', 'run-ended-early'];

/** Swelling-check details written by table mode. */
export const swellingCheckDetails = { increased: 'increased', notIncreased: 'not increased' } as const;

export const logEntrySchema = z
  .object({
    type: logEntryTypeSchema,
    /** The machine's running count (from 1): the order entries happened in, whatever order they arrive in. */
    seq: z.number().int().positive().max(100_000).optional(),
    stepIndex: z.number().int().nonnegative().max(99).optional(),
    kind: stepKindSchema.optional(),
    plannedSeconds: z.number().int().nonnegative().max(24 * 3600).optional(),
    actualSeconds: z.number().int().nonnegative().max(24 * 3600).optional(),
    at: isoInstant('Entry time'),
    reason: safeText('Reason').trim().min(1, 'Reason cannot be empty').max(500, 'Reason must be at most 500 characters').optional(),
    detail: safeText('Detail').max(500, 'Detail must be at most 500 characters').optional(),
  })
  .superRefine((entry, ctx) => {
    if (stepTypes.includes(entry.type) && entry.kind === undefined) {
      ctx.addIssue({ code: 'custom', path: ['kind'], message: `A ${entry.type} entry names the step's kind` });
    }
    if (reasonRequired.includes(entry.type) && entry.reason === undefined) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: `A ${entry.type} entry needs a reason` });
    }
  });
export type LogEntry = z.infer<typeof logEntrySchema>;

export const runStatuses = [
  'screening',
  'ready',
  'running',
  'completed',
  'fell-back',
  'stopped-referred',
  'ended-early',
  'abandoned',
] as const;
export const runStatusSchema = z.enum(runStatuses);
export type RunStatus = z.infer<typeof runStatusSchema>;

/** How a run ended, as table mode knows it; 'stop-elevate-refer' is a fall back where cold was not allowed. */
export const runOutcomes = ['completed', 'fell-back', 'stop-elevate-refer', 'stopped-referred', 'ended-early'] as const;
export const runOutcomeSchema = z.enum(runOutcomes);
export type RunOutcome = z.infer<typeof runOutcomeSchema>;

/** The stored status for an outcome: stop-elevate-refer is filed with the fall backs the supervisor is alerted to. */
export function statusForOutcome(outcome: RunOutcome): RunStatus {
  return outcome === 'stop-elevate-refer' ? 'fell-back' : outcome;
}
