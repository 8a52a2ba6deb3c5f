import { z } from 'zod';
import { phaseSchema } from '../phase';
import { functionalTestIds } from '../clinical/return-to-activity';
import { bodyRegionIdSchema, sideSchema } from './body-map';
import { boundedText, isPresent, pastInstant } from './fields';

export const mechanismKinds = ['knee-to-thigh', 'ball', 'stick-or-bat', 'fall', 'collision', 'other'] as const;
export const mechanismKindSchema = z.enum(mechanismKinds, {
  error: `Mechanism must be one of: ${mechanismKinds.join(', ')}`,
});
export type MechanismKind = z.infer<typeof mechanismKindSchema>;

/** Words for each mechanism, one place for the server's printouts and any screen. */
export const mechanismKindLabels: Record<MechanismKind, string> = {
  'knee-to-thigh': 'Knee to thigh',
  ball: 'Ball',
  'stick-or-bat': 'Stick or bat',
  fall: 'Fall',
  collision: 'Collision',
  other: 'Other',
};

export const haematomaTypes = ['intramuscular', 'intermuscular', 'not-known'] as const;
export const haematomaTypeSchema = z.enum(haematomaTypes, {
  error: `Haematoma type must be one of: ${haematomaTypes.join(', ')}`,
});
export type HaematomaType = z.infer<typeof haematomaTypeSchema>;

export const haematomaTypeLabels: Record<HaematomaType, string> = {
  intramuscular: 'Intramuscular',
  intermuscular: 'Intermuscular',
  'not-known': 'Not known yet',
};

export const injuryStatuses = ['open', 'closed'] as const;
export const injuryStatusSchema = z.enum(injuryStatuses, { error: 'Status must be open or closed' });
export type InjuryStatus = z.infer<typeof injuryStatusSchema>;

/** A therapist's phase, replacing the suggested one until cleared; the reason is kept for the review desk. */
export const phaseOverrideSchema = z.object({
  phase: phaseSchema,
  reason: boundedText('Override reason', 500, 5).describe('Why the suggested phase does not fit this athlete'),
});
export type PhaseOverride = z.infer<typeof phaseOverrideSchema>;

/** Body of the endpoint that sets or clears an override; wrapped in an object since JSON parsers reject a bare null. */
export const phaseOverrideBodySchema = z.object({
  override: phaseOverrideSchema.nullable(),
});
export type PhaseOverrideBody = z.infer<typeof phaseOverrideBodySchema>;

/*
 * Whether the athlete plays football is not stored here: it is read from the athlete's sport when the
 * injury is assessed, so correcting the sport corrects every injury's risk flags.
 */
const injuryFields = {
  athleteId: z.guid({ error: 'Athlete id must be a UUID' }),
  region: bodyRegionIdSchema,
  side: sideSchema,
  mechanismKind: mechanismKindSchema,
  mechanism: boundedText('Mechanism', 500).optional().describe('How it happened, in the therapist’s words'),
  injuredAt: pastInstant('Injury date and time'),
  haematomaType: haematomaTypeSchema.default('not-known'),
  previousQuadricepsInjury: z.boolean({ error: 'Previous quadriceps injury must be true or false' }).default(false),
  kneeEffusion: z.boolean({ error: 'Knee effusion must be true or false' }).default(false),
  treatmentStartedAt: pastInstant('Treatment start')
    .nullable()
    .optional()
    .describe('When treatment began; used for the "treatment delayed more than 3 days" risk factor'),
};

type InstantPair = { injuredAt?: string; treatmentStartedAt?: string | null };

function treatmentNotBeforeInjury(value: InstantPair, ctx: z.RefinementCtx): void {
  if (isPresent(value.injuredAt) && isPresent(value.treatmentStartedAt)) {
    if (Date.parse(value.treatmentStartedAt) < Date.parse(value.injuredAt)) {
      ctx.addIssue({
        code: 'custom',
        path: ['treatmentStartedAt'],
        message: 'Treatment start cannot be before the injury',
      });
    }
  }
}

export const injuryCreateSchema = z.object(injuryFields).superRefine(treatmentNotBeforeInjury);
export type InjuryCreate = z.infer<typeof injuryCreateSchema>;
export type InjuryCreateInput = z.input<typeof injuryCreateSchema>;

/*
 * The athlete of an injury never changes (a wrong athlete means a new injury), so athleteId is not in the
 * update. Defaults are dropped so that an omitted field means "unchanged", not "reset to false".
 */
export const injuryUpdateSchema = z
  .object({
    region: injuryFields.region,
    side: injuryFields.side,
    mechanismKind: injuryFields.mechanismKind,
    mechanism: injuryFields.mechanism,
    injuredAt: injuryFields.injuredAt,
    haematomaType: haematomaTypeSchema,
    previousQuadricepsInjury: z.boolean({ error: 'Previous quadriceps injury must be true or false' }),
    kneeEffusion: z.boolean({ error: 'Knee effusion must be true or false' }),
    treatmentStartedAt: injuryFields.treatmentStartedAt,
    status: injuryStatusSchema,
    closedAt: pastInstant('Closed date and time')
      .nullable()
      .describe('When the athlete returned to full function; the server sets it to now when closing without one'),
    phaseOverride: phaseOverrideSchema.nullable(),
  })
  .partial()
  .superRefine((value, ctx) => {
    treatmentNotBeforeInjury(value, ctx);
    if (value.status === 'open' && isPresent(value.closedAt)) {
      ctx.addIssue({ code: 'custom', path: ['closedAt'], message: 'An open injury cannot have a closed date' });
    }
    if (isPresent(value.closedAt) && isPresent(value.injuredAt) && Date.parse(value.closedAt) < Date.parse(value.injuredAt)) {
      ctx.addIssue({ code: 'custom', path: ['closedAt'], message: 'Closed date cannot be before the injury' });
    }
  });
export type InjuryUpdate = z.infer<typeof injuryUpdateSchema>;

/** POST /api/injuries/:id/close: the functional tests passed, and a reason when a criterion is unmet. */
export const injuryCloseSchema = z.object({
  passedTests: z
    .array(z.enum(functionalTestIds, { error: `Functional test must be one of: ${functionalTestIds.join(', ')}` }))
    .max(functionalTestIds.length)
    .default([])
    .describe('Functional tests the therapist performed and the athlete passed'),
  reason: boundedText('Reason', 1000)
    .optional()
    .transform((value) => (value ? value : undefined))
    .describe('Why the injury is closed although a criterion is unmet; required then'),
  closedAt: pastInstant('Closed date and time').optional().describe('When the athlete returned to full function; now when omitted'),
});
export type InjuryClose = z.infer<typeof injuryCloseSchema>;
export type InjuryCloseInput = z.input<typeof injuryCloseSchema>;

/** POST /api/injuries/:id/reinjury: a new blow to the same site after the episode was closed. */
export const reinjurySchema = z.object({
  mechanismKind: mechanismKindSchema,
  mechanism: injuryFields.mechanism,
  injuredAt: injuryFields.injuredAt,
  haematomaType: haematomaTypeSchema.default('not-known'),
});
export type Reinjury = z.infer<typeof reinjurySchema>;
export type ReinjuryInput = z.input<typeof reinjurySchema>;
