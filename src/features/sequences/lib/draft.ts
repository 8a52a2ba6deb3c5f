import { phases } from '../../../../shared/phase';
import { defaultSequences, sequenceSchema, type Sequence, type SequenceStep } from '../../../../shared/plan/sequence';
import { isWithinBounds, stepKindInfo, type StepKind } from '../../../../shared/plan/step-kinds';
import type { Phase } from '../../../../shared/phase';

/** A step as the editor holds it: the duration as typed, in minutes and seconds, and a key that survives reordering. */
export interface DraftStep {
  key: string;
  kind: StepKind;
  minutes: string;
  seconds: string;
  optional: boolean;
}

let nextKey = 1;
const newKey = () => `step-${nextKey++}`;

export function toDraft(steps: readonly SequenceStep[]): DraftStep[] {
  return steps.map((step) => ({
    key: newKey(),
    kind: step.kind,
    minutes: String(Math.floor(step.seconds / 60)),
    seconds: String(step.seconds % 60),
    optional: step.optional,
  }));
}

const wholeNumber = /^\d{1,4}$/;

/** Seconds from the two boxes, or null when either is not a whole number (or the seconds box is over 59). */
export function totalSeconds(step: Pick<DraftStep, 'minutes' | 'seconds'>): number | null {
  const m = step.minutes.trim() === '' ? '0' : step.minutes.trim();
  const s = step.seconds.trim() === '' ? '0' : step.seconds.trim();
  if (!wholeNumber.test(m) || !wholeNumber.test(s) || Number(s) > 59) return null;
  return Number(m) * 60 + Number(s);
}

/** A new step starts at the length the default sequences give its kind, which sits inside its bounds. */
export function newStep(kind: StepKind): DraftStep {
  const known = phases.flatMap((p) => defaultSequences[p].steps).find((s) => s.kind === kind);
  const { min, max } = stepKindInfo[kind].bounds;
  const seconds = known?.seconds ?? Math.min(max, Math.max(min, 180));
  return { key: newKey(), kind, minutes: String(Math.floor(seconds / 60)), seconds: String(seconds % 60), optional: false };
}

export function move<T>(items: readonly T[], from: number, to: number): T[] {
  if (to < 0 || to >= items.length) return [...items];
  const out = [...items];
  const [item] = out.splice(from, 1);
  out.splice(to, 0, item);
  return out;
}

export type StepErrors = Record<string, { seconds?: string; kind?: string }>;

/** The message beside a step's duration while it is typed: not a number, or outside the kind's safety bounds. */
export function durationProblem(step: DraftStep): string | undefined {
  const total = totalSeconds(step);
  if (total === null) return 'Enter whole minutes, and seconds from 0 to 59';
  if (!isWithinBounds(step.kind, total)) return 'Outside the safety bounds for this kind of step';
  return undefined;
}

/**
 * Checks the draft with the same schema the server uses, so what the editor accepts the server accepts.
 * Errors come back keyed by step (steps.N.seconds → that step's key), the rest as one message.
 */
export function checkDraft(phase: Phase, steps: DraftStep[]): { sequence: Sequence } | { stepErrors: StepErrors; formError?: string } {
  const result = sequenceSchema.safeParse({ phase, steps: steps.map((s) => ({ kind: s.kind, seconds: totalSeconds(s) ?? Number.NaN, optional: s.optional })) });
  if (result.success) return { sequence: result.data };
  const fields = Object.fromEntries(result.error.issues.map((issue) => [issue.path.join('.'), issue.message]));
  return fieldErrorsToSteps(fields, steps);
}

/** The server's 400 `fields` (and the schema's issues) as messages on the steps they name. */
export function fieldErrorsToSteps(fields: Record<string, string>, steps: DraftStep[]): { stepErrors: StepErrors; formError?: string } {
  const stepErrors: StepErrors = {};
  const other: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    const match = /^steps\.(\d+)\.(seconds|kind)$/.exec(path);
    const step = match ? steps[Number(match[1])] : undefined;
    if (match && step) stepErrors[step.key] = { ...stepErrors[step.key], [match[2]]: message };
    else other.push(message);
  }
  return { stepErrors, formError: other.length ? other.join('. ') : undefined };
}

export const sameSteps = (a: DraftStep[], b: readonly SequenceStep[]) =>
  a.length === b.length && a.every((s, i) => s.kind === b[i].kind && totalSeconds(s) === b[i].seconds && s.optional === b[i].optional);
