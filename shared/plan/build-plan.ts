import { z } from 'zod';
import { phaseSchema, type Phase } from '../phase';
import { capped, largestPadCm, oversizePadNote } from '../clinical/pad-size';
import { maxSequenceSteps, type Sequence } from './sequence';
import { boundsMessage, isWithinBounds, stepKindInfo, stepKindSchema, type StepKind } from './step-kinds';
import { coldGapBefore, coldTooSoonMessage, exclusionReason, isCold, stepRuleIssues, type PlanRestrictions } from './treatment-rules';

/** A run's plan: the clinic's sequence for the phase, adjusted for this athlete's screening and tolerance. */

export const tolerances = ['light', 'usual'] as const;
export const toleranceSchema = z.enum(tolerances, { error: 'Tolerance must be light or usual' });
export type Tolerance = z.infer<typeof toleranceSchema>;

/*
 * Light tolerance shortens hands-on steps to three quarters, never below the kind's minimum. A choice of ours:
 * no source gives a dose for a tender athlete, and three quarters keeps every step recognisably the same work.
 */
export const lightToleranceFactor = 0.75;

/** Where "swelling has increased" takes the run: cold and compression, or (cold contraindicated) out. */
export const backToColdModes = ['cold-and-compression', 'stop-elevate-refer'] as const;
export const backToColdModeSchema = z.enum(backToColdModes);
export type BackToColdMode = z.infer<typeof backToColdModeSchema>;

/** decisions.md: a fresh cold pack after ice massage waits the clinic's minimum interval, 10 min by default. */
export const defaultMinColdIntervalSeconds = 600;

const centimetres = (label: string) =>
  z
    .number({ error: `${label} must be a number of centimetres` })
    .positive(`${label} must be more than 0 cm`)
    .max(largestPadCm, `${label} must be at most ${largestPadCm} cm`);

/** The felt pad's size range (two to three times the injury, common practice), computed from the bruise. */
export const padSizeSchema = z
  .object({
    minLengthCm: centimetres('Pad minimum length'),
    maxLengthCm: centimetres('Pad maximum length'),
    minWidthCm: centimetres('Pad minimum width'),
    maxWidthCm: centimetres('Pad maximum width'),
  })
  .superRefine((pad, ctx) => {
    if (pad.minLengthCm > pad.maxLengthCm) {
      ctx.addIssue({ code: 'custom', path: ['maxLengthCm'], message: 'Pad maximum length cannot be below its minimum' });
    }
    if (pad.minWidthCm > pad.maxWidthCm) {
      ctx.addIssue({ code: 'custom', path: ['maxWidthCm'], message: 'Pad maximum width cannot be below its minimum' });
    }
  });
export type PadSize = z.infer<typeof padSizeSchema>;

export const planStepSchema = z.object({
  index: z.number().int().nonnegative(),
  kind: stepKindSchema,
  label: z.string().min(1),
  seconds: z.number().int().positive(),
  cue: z.string().min(1),
  needsConfirm: z.boolean(),
  handsOn: z.boolean(),
  optional: z.boolean(),
});
export type PlanStep = z.infer<typeof planStepSchema>;

export const planSchema = z
  .object({
    phase: phaseSchema,
    tolerance: toleranceSchema,
    steps: z.array(planStepSchema).max(maxSequenceSteps),
    cautions: z.array(z.string().min(1)),
    backToCold: backToColdModeSchema,
    padSize: padSizeSchema.nullable().default(null),
    minColdIntervalSeconds: z.number().int().min(0).max(3600).default(defaultMinColdIntervalSeconds),
  })
  .superRefine((plan, ctx) => {
    plan.steps.forEach((step, position) => {
      // Table mode and the log address steps by index; a gap would misfile every entry after it.
      if (step.index !== position) {
        ctx.addIssue({ code: 'custom', path: ['steps', position, 'index'], message: `Step index must be ${position}` });
      }
      if (!isWithinBounds(step.kind, step.seconds)) {
        ctx.addIssue({ code: 'custom', path: ['steps', position, 'seconds'], message: boundsMessage(step.kind) });
      }
      if (plan.backToCold === 'stop-elevate-refer' && isCold(step.kind)) {
        ctx.addIssue({
          code: 'custom',
          path: ['steps', position, 'kind'],
          message: 'A plan without cold (stop, elevate, refer) cannot hold a cold step',
        });
      }
    });
    // The treatment rules hold for every plan, stored or built, so the machine never plays an unsafe one.
    for (const issue of stepRuleIssues(plan.phase, plan.steps, plan.minColdIntervalSeconds)) {
      ctx.addIssue({ code: 'custom', path: ['steps', issue.index, issue.field], message: issue.message });
    }
  });
export type Plan = z.infer<typeof planSchema>;
export type PlanInput = z.input<typeof planSchema>;

export interface BuildPlanArgs {
  phase: Phase;
  sequence: Sequence;
  tolerance: Tolerance;
  padSize?: PadSize | null;
  /** The pad was capped at the largest size before it got here (the injury's assessment says so). */
  padOversize?: boolean;
  coldContraindicated: boolean;
  suspectedMyositis: boolean;
  /** Screening ticked anticoagulants or a bleeding disorder: no deep work (massage cautions, common practice). */
  bleedingRisk?: boolean;
  /** Screening ticked open skin over the area: no deep work (massage cautions, common practice). */
  openSkin?: boolean;
  /** The clinic's minimum break before a fresh cold pack; defaults to 10 minutes. */
  minColdIntervalSeconds?: number;
}

export const cautionTexts = {
  coldContraindicated:
    'Cold is contraindicated: cold pack and ice massage are left out. If swelling increases: stop, elevate and refer.',
  suspectedMyositis:
    'Suspected myositis ossificans: no friction, broadening or stripping; keep light work away from the firm area. Refer for imaging.',
  bleedingRisk:
    'Anticoagulants or a bleeding disorder: no friction, broadening or stripping; light work only, and watch for new bruising.',
  openSkin: 'Open skin over the area: no friction, broadening or stripping; keep work and ice off the open skin.',
  lightTolerance: 'Light tolerance: hands-on steps are shortened to three quarters of their time.',
  nothingLeft:
    'No steps are left after the screening changes: do not start table mode; go over the plan with your supervisor.',
} as const;

// Whole centimetres: a pad is cut by eye, and the cue must stay one line.
function formatCm(value: number): string {
  return String(Math.max(1, Math.round(value)));
}

function formatRange(min: number, max: number): string {
  return min === max ? formatCm(min) : `${formatCm(min)}–${formatCm(max)}`;
}

/** The wrap cue names the pad size when the injury's size is known; no published pad size exists to default to. */
export function compressionCue(padSize: PadSize | null | undefined): string {
  if (!padSize) return stepKindInfo['compression-wrap'].cue;
  const length = formatRange(padSize.minLengthCm, padSize.maxLengthCm);
  const width = formatRange(padSize.minWidthCm, padSize.maxWidthCm);
  return `Felt pad ${length} × ${width} cm; figure-of-eight wrap, below to above`;
}

export function stepCue(kind: StepKind, phase: Phase, padSize?: PadSize | null): string {
  if (kind === 'compression-wrap') return compressionCue(padSize);
  // In the acute phase the last rest is also the home-care hand-off, so its cue says so.
  if (kind === 'rest-recheck' && phase === 'acute') return 'Re-check the swelling, then go through home care';
  return stepKindInfo[kind].cue;
}

export function adjustedSeconds(kind: StepKind, seconds: number, tolerance: Tolerance): number {
  const info = stepKindInfo[kind];
  if (tolerance === 'usual' || !info.handsOn) return seconds;
  return Math.min(info.bounds.max, Math.max(info.bounds.min, Math.round(seconds * lightToleranceFactor)));
}

/** Steps of the same kind left out for the same reason are named once, in the order they came. */
function leftOutText(removed: { kind: StepKind; reason: string }[]): string[] {
  const byReason = new Map<string, string[]>();
  for (const { kind, reason } of removed) {
    const labels = byReason.get(reason) ?? [];
    if (!labels.includes(stepKindInfo[kind].label)) labels.push(stepKindInfo[kind].label);
    byReason.set(reason, labels);
  }
  return [...byReason].map(([reason, labels]) => `Left out of this plan: ${labels.join(', ')} (${reason}).`);
}

/** A pad larger than the table allows becomes the largest pad, flagged so the plan says why. */
function withinPadTable(pad: PadSize | null): { padSize: PadSize | null; padOversize: boolean } {
  if (!pad) return { padSize: null, padOversize: false };
  const length = capped({ minCm: pad.minLengthCm, maxCm: pad.maxLengthCm });
  const width = capped({ minCm: pad.minWidthCm, maxCm: pad.maxWidthCm });
  const padOversize = Math.max(pad.maxLengthCm, pad.maxWidthCm) > largestPadCm;
  return { padSize: { minLengthCm: length.minCm, maxLengthCm: length.maxCm, minWidthCm: width.minCm, maxWidthCm: width.maxCm }, padOversize };
}

export function buildPlan(args: BuildPlanArgs): Plan {
  const { phase, sequence, tolerance, coldContraindicated, suspectedMyositis } = args;
  const { padSize, padOversize } = withinPadTable(args.padSize ?? null);
  const minColdIntervalSeconds = args.minColdIntervalSeconds ?? defaultMinColdIntervalSeconds;
  if (sequence.phase !== phase) {
    throw new RangeError(`The sequence is for the ${sequence.phase} phase, not ${phase}`);
  }

  const deepWorkReasons: string[] = [
    suspectedMyositis ? cautionTexts.suspectedMyositis : null,
    args.bleedingRisk ? cautionTexts.bleedingRisk : null,
    args.openSkin ? cautionTexts.openSkin : null,
  ].filter((text) => text !== null);
  const restrictions: PlanRestrictions = { coldContraindicated, deepWorkReasons };
  const cautions: string[] = [...(coldContraindicated ? [cautionTexts.coldContraindicated] : []), ...deepWorkReasons];
  if (padOversize || args.padOversize) cautions.push(oversizePadNote);

  const removed: { kind: StepKind; reason: string }[] = [];
  const kept = sequence.steps
    .filter((step) => {
      const reason = exclusionReason(step.kind, phase, restrictions);
      if (reason) removed.push({ kind: step.kind, reason });
      return reason === null;
    })
    .map((step) => ({ ...step, seconds: adjustedSeconds(step.kind, step.seconds, tolerance) }));

  // Leaving steps out or shortening them can bring two cold steps closer than the clinic's interval: the later
  // cold step goes, and the plan says why (treatment rule 2).
  const timed: typeof kept = [];
  for (const step of kept) {
    const gap = isCold(step.kind) ? coldGapBefore([...timed, step], timed.length) : null;
    if (gap !== null && gap < minColdIntervalSeconds) {
      cautions.push(`Left out of this plan: ${coldTooSoonMessage(step.kind, gap, minColdIntervalSeconds)}.`);
      continue;
    }
    timed.push(step);
  }
  cautions.push(...leftOutText(removed));
  if (tolerance === 'light' && timed.some((step) => stepKindInfo[step.kind].handsOn)) {
    cautions.push(cautionTexts.lightTolerance);
  }

  const steps: PlanStep[] = timed.map((step, index) => {
    const info = stepKindInfo[step.kind];
    return {
      index,
      kind: step.kind,
      label: info.label,
      seconds: step.seconds,
      cue: stepCue(step.kind, phase, padSize),
      needsConfirm: info.needsConfirm,
      handsOn: info.handsOn,
      optional: step.optional,
    };
  });
  if (steps.length === 0) cautions.push(cautionTexts.nothingLeft);

  return planSchema.parse({
    phase,
    tolerance,
    steps,
    cautions,
    backToCold: coldContraindicated ? 'stop-elevate-refer' : 'cold-and-compression',
    padSize,
    minColdIntervalSeconds,
  });
}
