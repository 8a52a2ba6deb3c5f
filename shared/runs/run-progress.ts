import type { Plan } from '../plan/build-plan';
import type { LogEntryType, RunStatus } from './log-entry';

/** A run in progress as the office screens show it: which plan step it is on and, roughly, when that step ends. */
export interface RunInProgressView {
  runId: string;
  injuryId: string;
  athleteName: string;
  injuryLabel: string;
  therapistName: string;
  status: RunStatus;
  /** Index into the plan's steps of the step now under way; null before Begin. */
  stepIndex: number | null;
  stepCount: number;
  stepLabel: string | null;
  /** When the current step should end if it runs as planned (an estimate: pauses and extensions are not known here). */
  stepEndsAt: string | null;
  lastActivityAt: string;
}

type ProgressEntry = { type: LogEntryType; stepIndex: number | null; at: string | Date };

const stepEndingTypes: readonly LogEntryType[] = ['step-completed', 'step-skipped'];

/**
 * Where a run stands from the server's log alone: the step after the last plan step that ended, started when
 * that one ended (or when the run began). Back-to-cold steps have no plan index and are not counted.
 */
export function runProgress(plan: Plan, entries: readonly ProgressEntry[], startedAt: Date | string | null) {
  const ended = entries.filter((e) => stepEndingTypes.includes(e.type) && e.stepIndex !== null);
  const last = ended.reduce<ProgressEntry | null>((latest, e) => (!latest || (e.stepIndex ?? -1) > (latest.stepIndex ?? -1) ? e : latest), null);
  const stepIndex = last ? (last.stepIndex ?? -1) + 1 : startedAt ? 0 : null;
  const step = stepIndex !== null ? plan.steps[stepIndex] : undefined;
  const stepStartedAt = last ? new Date(last.at) : startedAt ? new Date(startedAt) : null;
  return {
    stepIndex: step ? stepIndex : null,
    stepCount: plan.steps.length,
    stepLabel: step?.label ?? null,
    stepEndsAt: step && stepStartedAt ? new Date(stepStartedAt.getTime() + step.seconds * 1000).toISOString() : null,
  };
}
