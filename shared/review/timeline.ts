import type { Plan } from '../plan/build-plan';
import { stepKindInfo, type StepKind } from '../plan/step-kinds';
import { stepResultTypes } from './attention';
import type { RunLogEntryView } from '../runs/responses';

/** One row of a run's timeline: a plan step or a back-to-cold step, planned against actual. */
export interface TimelineRow {
  /** The plan step's index; null for back-to-cold steps, which the plan does not hold. */
  stepIndex: number | null;
  kind: string;
  label: string;
  stage: 'plan' | 'back-to-cold';
  plannedSeconds: number;
  actualSeconds: number | null;
  result: 'completed' | 'skipped' | 'interrupted' | 'not-reached';
  reason: string | null;
  startedAt: string | null;
}
/** The client's name for the same row. */
export type TimelineStep = TimelineRow;

/** The parts of a log entry the timeline reads (a RunLogEntryView fits). */
export type TimelineEntry = Pick<RunLogEntryView, 'seq' | 'type' | 'stepIndex' | 'kind' | 'plannedSeconds' | 'actualSeconds' | 'at' | 'reason' | 'detail'>;

// The same words table mode shows for back to cold's steps (machines/treatment-run.ts fallbackStep).
const backToColdLabels: Partial<Record<StepKind, string>> = {
  'rest-recheck': 'Wait before cold',
  'cold-pack': 'Back to cold: cold pack',
  'compression-wrap': 'Back to cold: compression wrap',
};

const resultOf: Record<(typeof stepResultTypes)[number], TimelineRow['result']> = {
  'step-completed': 'completed',
  'step-skipped': 'skipped',
  'step-interrupted': 'interrupted',
};

function isStepResult(entry: TimelineEntry): entry is TimelineEntry & { type: (typeof stepResultTypes)[number] } {
  return (stepResultTypes as readonly string[]).includes(entry.type);
}

/** The log in the order things happened: the machine's count first, then time (as the run detail sorts it). */
export function inLogOrder<T extends Pick<TimelineEntry, 'seq' | 'at'>>(entries: readonly T[]): T[] {
  return entries
    .map((entry, position) => ({ entry, position }))
    .sort((a, b) => {
      if (a.entry.seq !== null && b.entry.seq !== null && a.entry.seq !== b.entry.seq) return a.entry.seq - b.entry.seq;
      if (a.entry.seq === null && b.entry.seq !== null) return 1;
      if (a.entry.seq !== null && b.entry.seq === null) return -1;
      const byTime = Date.parse(a.entry.at) - Date.parse(b.entry.at);
      return byTime !== 0 ? byTime : a.position - b.position;
    })
    .map(({ entry }) => entry);
}

/**
 * Every step reached, in the order it happened, then the plan steps never reached in plan order. A step's
 * start is when the step before it ended (pauses included, as the clock on the wall saw it); the first
 * step's start is its end less the time it ran, because nothing is logged at BEGIN.
 */
export function buildTimeline(plan: Pick<Plan, 'steps'>, entries: readonly TimelineEntry[]): TimelineRow[] {
  const ordered = inLogOrder(entries).filter(isStepResult);
  const reached: TimelineRow[] = [];
  const planRowByIndex = new Map<number, TimelineRow>();
  let previousEnd: string | null = null;

  for (const entry of ordered) {
    const startedAt =
      previousEnd ?? (entry.actualSeconds !== null ? new Date(Date.parse(entry.at) - entry.actualSeconds * 1000).toISOString() : null);
    previousEnd = entry.at;
    const planStep = entry.stepIndex !== null ? plan.steps[entry.stepIndex] : undefined;
    const kind = entry.kind ?? planStep?.kind ?? 'unknown';
    const row: TimelineRow = planStep
      ? {
          stepIndex: planStep.index,
          kind: planStep.kind,
          label: planStep.label,
          stage: 'plan',
          plannedSeconds: planStep.seconds,
          actualSeconds: entry.actualSeconds,
          result: resultOf[entry.type],
          reason: entry.reason,
          startedAt,
        }
      : {
          // Table mode logs back to cold's steps without an index; they are not in the plan.
          stepIndex: null,
          kind,
          label: backToColdLabels[kind as StepKind] ?? stepKindInfo[kind as StepKind]?.label ?? kind,
          stage: 'back-to-cold',
          plannedSeconds: entry.plannedSeconds ?? entry.actualSeconds ?? 0,
          actualSeconds: entry.actualSeconds,
          result: resultOf[entry.type],
          reason: entry.reason,
          startedAt,
        };
    if (planStep) {
      // A step closed twice (a replayed log from an older build) keeps its last word, in its first place.
      const earlier = planRowByIndex.get(planStep.index);
      if (earlier) {
        Object.assign(earlier, { ...row, startedAt: earlier.startedAt });
        continue;
      }
      planRowByIndex.set(planStep.index, row);
    }
    reached.push(row);
  }

  const notReached: TimelineRow[] = plan.steps
    .filter((step) => !planRowByIndex.has(step.index))
    .map((step) => ({
      stepIndex: step.index,
      kind: step.kind,
      label: step.label,
      stage: 'plan',
      plannedSeconds: step.seconds,
      actualSeconds: null,
      result: 'not-reached',
      reason: null,
      startedAt: null,
    }));
  return [...reached, ...notReached];
}
