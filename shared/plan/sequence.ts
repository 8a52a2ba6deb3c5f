import { z } from 'zod';
import { phaseSchema, type Phase } from '../phase';
import { boundsMessage, isWithinBounds, stepKindSchema } from './step-kinds';
import { shortestMinColdIntervalSeconds, stepRuleIssues } from './treatment-rules';

/** A clinic's template of steps for one phase. Its bounds are checked here so client and server agree. */

export const maxSequenceSteps = 20;

export const sequenceStepSchema = z
  .object({
    kind: stepKindSchema,
    seconds: z
      .number({ error: 'Seconds must be a number' })
      .int('Seconds must be a whole number')
      .positive('Seconds must be more than 0'),
    optional: z.boolean({ error: 'Optional must be true or false' }).default(false),
  })
  .superRefine((step, ctx) => {
    // Checked per step so the error's path lands on steps.N.seconds, the field the editor highlights.
    if (!isWithinBounds(step.kind, step.seconds)) {
      ctx.addIssue({ code: 'custom', path: ['seconds'], message: boundsMessage(step.kind) });
    }
  });
export type SequenceStep = z.infer<typeof sequenceStepSchema>;
export type SequenceStepInput = z.input<typeof sequenceStepSchema>;

export const sequenceSchema = z
  .object({
    phase: phaseSchema,
    steps: z
      .array(sequenceStepSchema)
      .min(1, 'A sequence needs at least one step')
      .max(maxSequenceSteps, `A sequence can hold at most ${maxSequenceSteps} steps`),
  })
  .superRefine((sequence, ctx) => {
    // The treatment rules (shared/plan/treatment-rules.ts), checked against the shortest interval a clinic can
    // set; the sequence service checks the clinic's own interval when it saves.
    for (const issue of stepRuleIssues(sequence.phase, sequence.steps, shortestMinColdIntervalSeconds)) {
      ctx.addIssue({ code: 'custom', path: ['steps', issue.index, issue.field], message: issue.message });
    }
  });
export type Sequence = z.infer<typeof sequenceSchema>;
export type SequenceInput = z.input<typeof sequenceSchema>;

/*
 * Durations are defaults of ours, except the 20-minute cold pack and the 6-minute ice massage, which sit
 * inside the common-practice rules (no continuous cold over 20 min; ice massage 5–7 min). Screening is a
 * form before the run (decisions.md), so it is not a step here.
 */
const defaults: Record<Phase, SequenceInput> = {
  acute: {
    phase: 'acute',
    steps: [
      { kind: 'cold-pack', seconds: 1200 },
      { kind: 'compression-wrap', seconds: 180 },
      // The hand-off: re-check the swelling, then go through home care with the athlete.
      { kind: 'rest-recheck', seconds: 300 },
    ],
  },
  proliferative: {
    phase: 'proliferative',
    steps: [
      { kind: 'ice-massage', seconds: 360 },
      { kind: 'light-strokes', seconds: 300 },
      { kind: 'passive-movement', seconds: 180 },
      { kind: 'active-movement', seconds: 180 },
      { kind: 'rest-recheck', seconds: 120 },
      { kind: 'ice-massage', seconds: 360, optional: true },
    ],
  },
  remodelling: {
    phase: 'remodelling',
    steps: [
      { kind: 'warm-up-strokes', seconds: 300 },
      { kind: 'cross-fibre-friction', seconds: 180 },
      { kind: 'multidirectional-friction', seconds: 180 },
      { kind: 'passive-broadening', seconds: 120 },
      { kind: 'active-broadening', seconds: 120 },
      { kind: 'passive-stripping', seconds: 120 },
      { kind: 'active-stripping', seconds: 120 },
      // Only if the area is sore after the deep work; the therapist skips it otherwise, giving the reason.
      { kind: 'ice-massage', seconds: 360, optional: true },
    ],
  },
};

// Parsed at load, so a default that breaks its own bounds fails every test instead of reaching a clinic.
export const defaultSequences: Readonly<Record<Phase, Sequence>> = {
  acute: sequenceSchema.parse(defaults.acute),
  proliferative: sequenceSchema.parse(defaults.proliferative),
  remodelling: sequenceSchema.parse(defaults.remodelling),
};
