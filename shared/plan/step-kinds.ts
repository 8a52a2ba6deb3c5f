import { z } from 'zod';
import { sources } from '../clinical/sources';

/**
 * The kinds of step a sequence can hold, with everything table mode and the sequence editor need to know
 * about each. Cue texts are our own wording, short enough to read from two metres.
 */
export const stepKinds = [
  'cold-pack',
  'compression-wrap',
  'ice-massage',
  'light-strokes',
  'passive-movement',
  'active-movement',
  'warm-up-strokes',
  'cross-fibre-friction',
  'multidirectional-friction',
  'passive-broadening',
  'active-broadening',
  'passive-stripping',
  'active-stripping',
  'rest-recheck',
] as const;

export const stepKindSchema = z.enum(stepKinds, { error: `Step kind must be one of: ${stepKinds.join(', ')}` });
export type StepKind = z.infer<typeof stepKindSchema>;

export interface SecondsBounds {
  min: number;
  max: number;
}

export interface StepKindInfo {
  kind: StepKind;
  label: string;
  /** One line of our own wording, shown large in table mode. */
  cue: string;
  /** The therapist's hands work on the athlete during the step. */
  handsOn: boolean;
  /** Stroke work on the tissue; kept out of the acute phase ("no massage for 24–72 h", common practice). */
  massage: boolean;
  /** Applies cold: removed when cold is contraindicated, and bounded by the cold rules. */
  cold: boolean;
  /** Deep work over the site: never where myositis ossificans is suspected. */
  deepWork: boolean;
  /** The step ends only when the therapist confirms it (the timer is a guide). */
  needsConfirm: boolean;
  /** What the therapist confirms, worded as the question table mode asks. */
  confirmPrompt: string | null;
  /** Safety bounds for the step's duration, in seconds; the clinic's sequence must stay inside them. */
  bounds: SecondsBounds;
  /** Where the bounds come from, quoted beside them in the sequence editor. */
  boundsSource: string;
}

const oursDefault = 'a clinic default of ours (no published figure)';

// One row per kind; `satisfies` makes a missing kind a compile error rather than a runtime gap.
const table = {
  'cold-pack': {
    label: 'Cold pack',
    cue: 'Cold pack on over a damp cloth — athlete rests',
    handsOn: false,
    massage: false,
    cold: true,
    deepWork: false,
    needsConfirm: false,
    confirmPrompt: null,
    // 20 min is the longest continuous cold we schedule; Otte et al.'s longer times are information only.
    bounds: { min: 300, max: 1200 },
    boundsSource: `max 20 min of continuous cold: ${sources.commonPractice}; min: ${oursDefault}`,
  },
  'compression-wrap': {
    label: 'Compression wrap',
    cue: 'Felt pad on the site; figure-of-eight wrap, below to above',
    handsOn: true,
    massage: false,
    cold: false,
    deepWork: false,
    needsConfirm: true,
    confirmPrompt: 'Wrap applied?',
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'ice-massage': {
    label: 'Ice massage',
    cue: 'Ice in small circles, centre outwards — keep it moving',
    handsOn: true,
    massage: false,
    cold: true,
    deepWork: false,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 300, max: 420 },
    boundsSource: `5–7 min at a time: ${sources.commonPractice}`,
  },
  'light-strokes': {
    label: 'Light centre-out strokes',
    cue: 'Light strokes from the centre outwards',
    handsOn: true,
    massage: true,
    cold: false,
    deepWork: false,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'passive-movement': {
    label: 'Passive movement',
    cue: 'Move the limb for them — pain-free range only',
    handsOn: true,
    massage: false,
    cold: false,
    deepWork: false,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'active-movement': {
    label: 'Active movement',
    cue: 'Athlete moves slowly — stop short of pain',
    // The athlete does the work; the therapist watches and counts.
    handsOn: false,
    massage: false,
    cold: false,
    deepWork: false,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'warm-up-strokes': {
    label: 'Warm-up strokes',
    cue: 'Broad warm-up strokes around the area',
    handsOn: true,
    massage: true,
    cold: false,
    deepWork: false,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'cross-fibre-friction': {
    label: 'Cross-fibre friction',
    cue: 'Friction across the fibres, to tolerance',
    handsOn: true,
    massage: true,
    cold: false,
    deepWork: true,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'multidirectional-friction': {
    label: 'Multidirectional friction',
    cue: 'Friction in every direction, to tolerance',
    handsOn: true,
    massage: true,
    cold: false,
    deepWork: true,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'passive-broadening': {
    label: 'Passive broadening',
    cue: 'Spread the muscle sideways, limb relaxed',
    handsOn: true,
    massage: true,
    cold: false,
    deepWork: true,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'active-broadening': {
    label: 'Active broadening',
    cue: 'Spread the muscle as the athlete contracts',
    handsOn: true,
    massage: true,
    cold: false,
    deepWork: true,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'passive-stripping': {
    label: 'Passive stripping',
    cue: 'Slow stroke along the fibres, limb relaxed',
    handsOn: true,
    massage: true,
    cold: false,
    deepWork: true,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'active-stripping': {
    label: 'Active stripping',
    cue: 'Stroke along the fibres as the athlete moves',
    handsOn: true,
    massage: true,
    cold: false,
    deepWork: true,
    needsConfirm: false,
    confirmPrompt: null,
    bounds: { min: 60, max: 600 },
    boundsSource: oursDefault,
  },
  'rest-recheck': {
    label: 'Rest and re-check',
    cue: 'Rest — then re-check the swelling',
    handsOn: false,
    massage: false,
    cold: false,
    deepWork: false,
    needsConfirm: true,
    confirmPrompt: 'Swelling the same or less?',
    bounds: { min: 30, max: 900 },
    boundsSource: oursDefault,
  },
} satisfies Record<StepKind, Omit<StepKindInfo, 'kind'>>;

export const stepKindInfo: Readonly<Record<StepKind, StepKindInfo>> = Object.fromEntries(
  stepKinds.map((kind) => [kind, { kind, ...table[kind] }]),
) as Record<StepKind, StepKindInfo>;

export function boundsMessage(kind: StepKind): string {
  const { label, bounds } = stepKindInfo[kind];
  return `${label} must last between ${bounds.min} and ${bounds.max} seconds (${minutes(bounds.min)}–${minutes(bounds.max)} min)`;
}

// Minutes read better than seconds to people; one decimal keeps 90 s as "1.5".
function minutes(seconds: number): string {
  return String(Math.round((seconds / 60) * 10) / 10);
}

export function isWithinBounds(kind: StepKind, seconds: number): boolean {
  const { min, max } = stepKindInfo[kind].bounds;
  return Number.isInteger(seconds) && seconds >= min && seconds <= max;
}
