import { currentStep, type TreatmentRunSnapshot } from '../../../../machines/treatment-run';
import type { RunOutcome } from '../../../../shared/runs/log-entry';

/*
 * Which audio cues are due, worked out from timestamps alone.
 *
 * Table mode looks at the run every so often (an animation frame, an interval, a visibility change) and asks
 * "what became due since I last looked?". Every cue has an absolute due time derived from the step's start
 * and deadline, so a 45-minute run never drifts however irregular the looks are, and a look after the tab
 * slept sees each cue once. Counting ticks would do neither.
 */

export const cueNames = ['step-start', 'one-minute', 'final-five', 'step-end', 'run-complete', 'back-to-cold', 'needs-you'] as const;
export type CueName = (typeof cueNames)[number];

export interface DueCue {
  cue: CueName;
  /** When the cue was due (ms since the epoch); pass it to CuePlayer.play as `scheduledAt`. */
  dueAt: number;
}

/** What the schedule needs to know about the step on screen. */
export interface CueStep {
  /** When the step began (ms since the epoch). */
  startedAt: number;
  /** Its length in seconds, extensions included. */
  seconds: number;
  /** Its end waits for the therapist, so the end cue calls them rather than marking a change. */
  needsConfirm: boolean;
}

/**
 * Countdown cues played late would announce a wrong time ("one minute left" with 20 s left), so after this
 * long they are dropped. State cues (start, end, needs-you) play however late: they say something changed.
 */
export const staleCueMs = 1500;
/** Below this length a step has no "one minute left": it would come too soon after the start to help. */
export const oneMinuteCueAboveSeconds = 90;
const finalSeconds = 5;

export interface CuesDueArgs {
  step: CueStep | null;
  /** The step's deadline; null while paused or for an untimed step, when nothing counts down. */
  deadline: number | null;
  /** The time of the previous look; cues due at or before it were already handled. */
  previousNow: number;
  now: number;
}

/** The cues of one step that fell due in (previousNow, now], oldest first. */
export function cuesDueAt({ step, deadline, previousNow, now }: CuesDueArgs): DueCue[] {
  if (step === null || !(now > previousNow)) return [];
  const inWindow = (t: number) => t > previousNow && t <= now;
  const fresh = (t: number) => now - t <= staleCueMs;
  const due: DueCue[] = [];

  if (inWindow(step.startedAt)) due.push({ cue: 'step-start', dueAt: step.startedAt });
  if (deadline !== null) {
    const oneMinute = deadline - 60_000;
    if (step.seconds > oneMinuteCueAboveSeconds && oneMinute > step.startedAt && inWindow(oneMinute) && fresh(oneMinute)) {
      due.push({ cue: 'one-minute', dueAt: oneMinute });
    }
    const endDue = inWindow(deadline);
    // The end cue says it all; a tick beside it would only blur it.
    if (!endDue) {
      // One tick per look at most: a late look must not fire a burst.
      for (let left = 1; left <= finalSeconds; left++) {
        const t = deadline - left * 1000;
        if (t > step.startedAt && inWindow(t) && fresh(t)) {
          due.push({ cue: 'final-five', dueAt: t });
          break;
        }
      }
    } else {
      due.push({ cue: step.needsConfirm ? 'needs-you' : 'step-end', dueAt: deadline });
    }
  }
  return due.sort((a, b) => a.dueAt - b.dueAt);
}

/** The names of the cues due: `cuesDueAt` without the due times. */
export function cuesDue(args: CuesDueArgs): CueName[] {
  return cuesDueAt(args).map((due) => due.cue);
}

/** One look at the run, as the schedule needs it. Build it with `observeRun`. */
export interface RunObservation {
  now: number;
  /** Changes whenever a new step starts (a pause, resume or extension keeps it). */
  stepId: string | null;
  step: CueStep | null;
  deadline: number | null;
  stage: 'plan' | 'back-to-cold' | null;
  /** Set once the run has ended. */
  outcome: RunOutcome | null;
  endedAt: number | null;
}

export function observeRun(snapshot: TreatmentRunSnapshot, now: number): RunObservation {
  const { context } = snapshot;
  const step = currentStep(snapshot);
  const startedAt = context.stepStartedAt;
  const done = snapshot.status === 'done';
  return {
    now,
    stepId: step && startedAt !== null ? `${step.stage}:${step.index ?? '-'}:${step.kind}:${startedAt}` : null,
    step:
      step && startedAt !== null
        ? { startedAt, seconds: step.seconds + context.extendedSeconds, needsConfirm: step.needsConfirm }
        : null,
    deadline: step ? context.deadline : null,
    stage: step?.stage ?? null,
    outcome: done ? context.outcome : null,
    endedAt: done ? context.endedAt : null,
  };
}

/**
 * Every cue due between two looks at the run, step changes and the run's end included.
 *
 * `previous` is null on the first look (table mode just opened, or reopened after a reload): only cues due
 * in the last `staleCueMs` play then, so a restored run is not greeted with its step's old start.
 *
 * Where two cues mark the same moment, one plays: a timed step's end already announces the next step
 * (whose name is spoken), so the next step's start cue is dropped; the run's end replaces the last step's
 * end; entering back to cold plays its own cue instead of a step start; a fall back where cold is not
 * allowed ("stop, elevate, refer") calls the therapist with needs-you. A run ended by the therapist's own
 * tap (red flag, finish early) plays nothing: they are looking at the screen.
 */
export function cuesBetween(previous: RunObservation | null, current: RunObservation): DueCue[] {
  const previousNow = previous?.now ?? current.now - staleCueMs;
  const due: DueCue[] = [];
  const stepChanged = previous !== null && previous.stepId !== current.stepId;

  let oldEndedOnTimer = false;
  if (stepChanged && previous.step !== null) {
    // The old step's cues can only be due up to the moment it gave way.
    const gaveWayAt = current.step?.startedAt ?? current.endedAt ?? current.now;
    due.push(
      ...cuesDueAt({ step: previous.step, deadline: previous.deadline, previousNow, now: Math.min(current.now, gaveWayAt) }),
    );
    // Its step-end may have been heard at this look or at the one before (a look at the very deadline).
    oldEndedOnTimer = !previous.step.needsConfirm && previous.deadline !== null && previous.deadline <= gaveWayAt;
  }

  // A step the previous look did not see began after that look, even within the same millisecond.
  const newStepFrom = stepChanged && current.step !== null ? Math.min(previousNow, current.step.startedAt - 1) : previousNow;
  for (const cue of cuesDueAt({ step: current.step, deadline: current.deadline, previousNow: newStepFrom, now: current.now })) {
    if (cue.cue === 'step-start') {
      const enteredBackToCold = current.stage === 'back-to-cold' && previous !== null && previous.stage !== 'back-to-cold';
      if (enteredBackToCold) {
        due.push({ cue: 'back-to-cold', dueAt: cue.dueAt });
        continue;
      }
      if (oldEndedOnTimer) continue;
    }
    due.push(cue);
  }

  const endedAt = current.endedAt ?? current.now;
  const justEnded =
    current.outcome !== null && (previous === null ? endedAt > previousNow : previous.outcome === null);
  if (justEnded) {
    if (current.outcome === 'completed' || current.outcome === 'fell-back') {
      const withoutStepEnd = due.filter((d) => d.cue !== 'step-end');
      due.length = 0;
      due.push(...withoutStepEnd, { cue: 'run-complete', dueAt: endedAt });
    } else if (current.outcome === 'stop-elevate-refer') {
      due.push({ cue: 'needs-you', dueAt: endedAt });
    }
  }
  return due.sort((a, b) => a.dueAt - b.dueAt);
}
