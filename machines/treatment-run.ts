import { and, assertEvent, enqueueActions, setup, type SnapshotFrom } from 'xstate';
import { planSchema, compressionCue, type Plan, type PlanInput, type PlanStep } from '../shared/plan/build-plan';
import { stepKindInfo, type StepKind } from '../shared/plan/step-kinds';
import { coldWaitMs, isCold, maxStepSeconds } from '../shared/plan/treatment-rules';
import { swellingCheckDetails, type LogEntry, type RunOutcome } from '../shared/runs/log-entry';
import { redFlagLabel, type RedFlagId } from '../shared/runs/screening';

/*
 * The treatment run: table mode's statechart.
 *
 * Time. Every event from the UI carries `at`, the wall-clock time in ms since the epoch when it happened
 * (the UI sends `Date.now()`; tests send `clock.now()` of a SimulatedClock). The step timer's own event has
 * no `at`: its time is read from the actor's clock (`now()`, which SimulatedClock has and `wallClock` below
 * adds to the browser's timers), because a timer can fire late (a sleeping tablet) and the next step must
 * start when the therapist can see it, not back-dated to the old deadline. With a clock that has no
 * `now()`, the deadline itself is used. Nothing else reads a clock, so the same events give the same log.
 * `at` and the actor's clock must be the same clock, or timers and deadlines disagree: in the browser,
 * `createActor(treatmentRunMachine, { input: { plan, now: Date.now() }, clock: wallClock })` and
 * `at: Date.now()`; in tests, a SimulatedClock and `at: clock.now()`.
 *
 * Timers. A timed step keeps its absolute `deadline` in context (and `remainingMs` while paused). The
 * state's `after` delay is `deadline - lastAt`, where `lastAt` is the time of the event that entered the
 * state; that `after` timer is what advances the run hands-free.
 *
 * Restore. XState 5.33.3 does not re-arm `after` delays for an actor created from a persisted snapshot
 * (statelyai/xstate issue 5331), so a restored run would sit in its step for ever. The UI therefore restores
 * with `createActor(treatmentRunMachine, { snapshot, input: { plan: snapshot.context.plan }, clock: wallClock })`
 * (the input is ignored beside a snapshot; TypeScript asks for it), starts it, and sends
 * `TICK { at: Date.now() }` at once, and again whenever table mode becomes visible
 * again after the tablet slept. In a timed state, a TICK at or after the deadline finishes the step as the
 * timer would have (its entry notes how late the end was noticed) and the next step starts at the TICK's
 * time; a TICK before the deadline re-enters the state, re-arming the timer for exactly `deadline - at`.
 * Anywhere else a TICK only notes the time, so sending it too often is harmless.
 *
 * Log. Each completed, skipped or interrupted step, swelling check, pause, resume, extension, red flag and
 * run end is emitted as `{ type: 'log', seq, entry }` (entry matches shared/runs/log-entry.ts); `seq` counts
 * from 1 and `logSeq` in context is the last one emitted. XState delivers emitted events after the new
 * snapshot is in place and before snapshot subscribers hear of it: buffer the entries of one transition
 * and store them with `getPersistedSnapshot()` in the same IndexedDB transaction (decisions.md), so a
 * reload can neither lose an entry nor log one twice.
 */

/** The browser's timers plus `now()`, so a late-firing step timer knows the real time. */
export const wallClock = {
  setTimeout: (fn: (...args: unknown[]) => void, ms: number): unknown => globalThis.setTimeout(fn, ms),
  clearTimeout: (id: unknown): void => globalThis.clearTimeout(id as ReturnType<typeof setTimeout>),
  now: (): number => Date.now(),
};

export const extendStepSeconds = 60;
/** A fall back's cold pack when the plan itself has none: the longest continuous cold (common practice). */
export const fallbackColdPackSeconds = 1200;
/** A guide time for the fall back's wrap when the plan has none; the therapist confirms it either way. */
export const fallbackWrapSeconds = 180;

export type RunStage = 'plan' | 'back-to-cold';

/** The step on screen: one of the plan's (index set) or one of back to cold's (index null). */
export interface RunStep extends Omit<PlanStep, 'index'> {
  index: number | null;
  stage: RunStage;
}

export interface TreatmentRunInput {
  plan: PlanInput;
  /** When the run was loaded (ms since the epoch); the time until BEGIN arrives with its own. */
  now?: number;
}

export interface TreatmentRunContext {
  plan: Plan;
  /** The plan step in progress, or the one back to cold interrupted; -1 before BEGIN. */
  currentIndex: number;
  step: RunStep | null;
  stepStartedAt: number | null;
  /** When the timed step ends (ms since the epoch); null while paused and for untimed steps. */
  deadline: number | null;
  /** Set only while paused. */
  remainingMs: number | null;
  extendedSeconds: number;
  /** The last EXTEND could not add time: the step is at its safety bound. */
  extendRefused: boolean;
  /** Time of the latest event the machine handled. */
  lastAt: number;
  logSeq: number;
  swellingChecks: number;
  lastSwelling: (typeof swellingCheckDetails)[keyof typeof swellingCheckDetails] | null;
  /** Swelling was found increased during the step on screen: its check is logged once, never also "not increased". */
  stepSwellingIncreased: boolean;
  /** Swelling was found increased at any point of the run: an acute run then ends as a fall back and alerts. */
  swellingIncreased: boolean;
  /** When the last cold step came off (ms since the epoch), for the wait before the next (treatment rule 2). */
  lastColdEndedAt: number | null;
  /** The step that swelling interrupted, when the run went back to cold. */
  interruptedKind: StepKind | null;
  outcome: RunOutcome | null;
  startedAt: number | null;
  endedAt: number | null;
}

export type TreatmentRunEvent =
  | { type: 'BEGIN'; at: number }
  | { type: 'PAUSE'; at: number }
  | { type: 'RESUME'; at: number }
  | { type: 'EXTEND'; at: number }
  | { type: 'SKIP'; at: number; reason: string }
  | { type: 'NEXT'; at: number }
  | { type: 'SWELLING_INCREASED'; at: number }
  | { type: 'RED_FLAG'; at: number; flag: RedFlagId | (string & {}) }
  | { type: 'FINISH_EARLY'; at: number; reason: string }
  | { type: 'TICK'; at: number };

export interface LogEmitted {
  type: 'log';
  seq: number;
  entry: LogEntry;
}

export interface TreatmentRunOutput {
  outcome: RunOutcome | null;
}

interface Change {
  patch?: Partial<TreatmentRunContext>;
  entries?: LogEntry[];
}

interface Committer {
  emit: (event: LogEmitted) => void;
  assign: (patch: Partial<TreatmentRunContext>) => void;
}

function commit(enqueue: Committer, context: TreatmentRunContext, change: Change): void {
  const entries = change.entries ?? [];
  entries.forEach((entry, offset) => enqueue.emit({ type: 'log', seq: context.logSeq + offset + 1, entry }));
  enqueue.assign({ ...change.patch, logSeq: context.logSeq + entries.length });
}

const iso = (ms: number) => new Date(ms).toISOString();
const wholeSeconds = (ms: number) => Math.max(0, Math.round(ms / 1000));

/** The time an event happened: its `at`, or for the step timer's own event, the actor's clock. */
function timeOf(context: TreatmentRunContext, event: { type: string }, clock: unknown): number {
  const at = (event as { at?: unknown }).at;
  // Never let time run backwards: a late-delivered event must not lengthen a timer already armed.
  if (typeof at === 'number' && Number.isFinite(at)) return Math.max(at, context.lastAt);
  const fired = context.deadline ?? context.lastAt;
  const now = (clock as { now?: unknown } | undefined)?.now;
  const clockNow = typeof now === 'function' ? Number(now.call(clock)) : Number.NaN;
  return Math.max(fired, context.lastAt, Number.isFinite(clockNow) ? clockNow : fired);
}

function totalMs(context: TreatmentRunContext): number {
  return ((context.step?.seconds ?? 0) + context.extendedSeconds) * 1000;
}

/** Time the current step has actually run at `now`, pauses excluded. */
function elapsedMs(context: TreatmentRunContext, now: number): number {
  if (context.remainingMs !== null) return totalMs(context) - context.remainingMs;
  if (context.deadline !== null) return totalMs(context) - (context.deadline - now);
  return context.stepStartedAt === null ? 0 : now - context.stepStartedAt;
}

function stepEntry(
  type: LogEntry['type'],
  context: TreatmentRunContext,
  at: number,
  extra: Partial<LogEntry> = {},
): LogEntry {
  const step = context.step!;
  const entry: LogEntry = { type, kind: step.kind, plannedSeconds: step.seconds, at: iso(at), ...extra };
  if (step.index !== null) entry.stepIndex = step.index;
  if (step.stage === 'back-to-cold' && entry.detail === undefined) entry.detail = 'back to cold';
  // The plan's own wait before a cold step is no step of the plan: it has no index, and says what it was.
  if (step.stage === 'plan' && step.index === null && entry.detail === undefined) entry.detail = 'wait before cold';
  return entry;
}

function startStep(step: RunStep, at: number, timed = true): Partial<TreatmentRunContext> {
  return {
    step,
    stepStartedAt: at,
    deadline: timed ? at + step.seconds * 1000 : null,
    remainingMs: null,
    extendedSeconds: 0,
    extendRefused: false,
    stepSwellingIncreased: false,
  };
}

function planStep(plan: Plan, index: number): RunStep {
  return { ...plan.steps[index], stage: 'plan' };
}

function fallbackStep(plan: Plan, kind: 'rest-recheck' | 'cold-pack' | 'compression-wrap', waitSeconds = plan.minColdIntervalSeconds): RunStep {
  const base = { index: null, stage: 'back-to-cold' as const, optional: false };
  const fromPlan = plan.steps.find((step) => step.kind === kind);
  if (kind === 'rest-recheck') {
    return {
      ...base,
      kind,
      label: 'Wait before cold',
      seconds: waitSeconds,
      cue: 'Ice off — skin rests before a fresh cold pack',
      needsConfirm: false,
      handsOn: false,
    };
  }
  if (kind === 'cold-pack') {
    return {
      ...base,
      kind,
      label: 'Back to cold: cold pack',
      seconds: fromPlan?.seconds ?? fallbackColdPackSeconds,
      cue: stepKindInfo['cold-pack'].cue,
      needsConfirm: false,
      handsOn: false,
    };
  }
  return {
    ...base,
    kind,
    label: 'Back to cold: compression wrap',
    seconds: fromPlan?.seconds ?? fallbackWrapSeconds,
    cue: compressionCue(plan.padSize),
    needsConfirm: true,
    handsOn: true,
  };
}

const finished = (outcome: RunOutcome, at: number): Partial<TreatmentRunContext> => ({
  outcome,
  endedAt: at,
  deadline: null,
  remainingMs: null,
});

/** Treatment rule 2: the wait a fresh cold step needs at `now`, in whole seconds (0: none). */
function coldWaitSeconds(context: TreatmentRunContext, now: number, currentIsCold: boolean): number {
  const ms = coldWaitMs({
    now,
    // Snapshots stored by an older build have no such field: they count from nothing, as they did.
    lastColdEndedAt: context.lastColdEndedAt ?? null,
    currentIsCold,
    minColdIntervalSeconds: context.plan.minColdIntervalSeconds,
  });
  return Math.ceil(ms / 1000);
}

/** A step coming off at `at`: when it is cold, the next cold step's wait counts from here. */
function coldEnded(context: TreatmentRunContext, at: number): Partial<TreatmentRunContext> {
  return context.step && isCold(context.step.kind) ? { lastColdEndedAt: at } : {};
}

const eventAt = (context: TreatmentRunContext, event: { type: string }) => timeOf(context, event, undefined);

/**
 * A timed step of back to cold: its timer, or a TICK past its deadline after a restore, moves on to `next`;
 * an earlier TICK re-arms the timer for the time left; EXTEND adds to it within the kind's bound.
 */
function timedBackToColdStep<Self extends string, Next extends string, Start extends string>(self: Self, next: Next, start: Start) {
  const moveOn = { target: next, actions: ['noteTime', 'recordStepTimedOut', start] as ['noteTime', 'recordStepTimedOut', Start] };
  return {
    after: { stepTimer: moveOn },
    on: {
      TICK: [{ guard: 'isDeadlinePassed' as const, ...moveOn }, { target: self, reenter: true, actions: 'noteTime' as const }],
      EXTEND: { target: self, reenter: true, actions: ['noteTime', 'extendStep'] as ['noteTime', 'extendStep'] },
    },
  };
}

export const treatmentRunMachine = setup({
  types: {
    context: {} as TreatmentRunContext,
    events: {} as TreatmentRunEvent,
    // TypeScript asks for input on a restore too; XState ignores it there, when a snapshot is given.
    input: {} as TreatmentRunInput,
    emitted: {} as LogEmitted,
    output: {} as TreatmentRunOutput,
  },
  delays: {
    stepTimer: ({ context }) => Math.max(0, (context.deadline ?? context.lastAt) - context.lastAt),
  },
  guards: {
    planHasNoSteps: ({ context }) => context.plan.steps.length === 0,
    hasNextStep: ({ context }) => context.currentIndex + 1 < context.plan.steps.length,
    hasReason: ({ event }) => 'reason' in event && typeof event.reason === 'string' && event.reason.trim() !== '',
    hasFlag: ({ event }) => 'flag' in event && typeof event.flag === 'string' && event.flag.trim() !== '',
    stepNeedsConfirm: ({ context }) => context.step?.needsConfirm === true,
    isDeadlinePassed: ({ context, event }) =>
      context.deadline !== null && 'at' in event && typeof event.at === 'number' && event.at >= context.deadline,
    // A cold pack stays on the limb whether or not its countdown stops; pausing it would hide cold past 20 min.
    canPause: ({ context }) => context.step?.kind !== 'cold-pack',
    isColdContraindicated: ({ context }) => context.plan.backToCold === 'stop-elevate-refer',
    isAcutePhase: ({ context }) => context.plan.phase === 'acute',
    // Older stored snapshots lack these fields: undefined reads as "not found".
    isSwellingAlreadyIncreasedThisStep: ({ context }) => context.stepSwellingIncreased === true,
    hasSwellingIncreased: ({ context }) => context.swellingIncreased === true,
    // Treatment rule 2 (decisions.md): a fresh cold pack waits until the clinic's minimum interval has passed
    // since the last cold step came off, whether that was this step, or one a rest or a check ago.
    needsWaitBeforeCold: ({ context, event }) =>
      coldWaitSeconds(context, eventAt(context, event), context.step !== null && isCold(context.step.kind)) > 0,
    nextPlanStepMustWait: ({ context }) => {
      const next = context.plan.steps[context.currentIndex + 1];
      return next !== undefined && isCold(next.kind) && coldWaitSeconds(context, context.lastAt, false) > 0;
    },
  },
  actions: {
    noteTime: enqueueActions(({ context, event, enqueue, self }) => {
      enqueue.assign({ lastAt: timeOf(context, event, self.system._clock) });
    }),
    startFirstStep: enqueueActions(({ context, enqueue }) => {
      enqueue.assign({
        ...startStep(planStep(context.plan, 0), context.lastAt),
        currentIndex: 0,
        startedAt: context.lastAt,
      });
    }),
    startNextStep: enqueueActions(({ context, enqueue }) => {
      const index = context.currentIndex + 1;
      enqueue.assign({ ...startStep(planStep(context.plan, index), context.lastAt), currentIndex: index });
    }),
    startWaitBeforeCold: enqueueActions(({ context, enqueue }) => {
      // The step just interrupted has already been logged, and if it was cold, it came off now.
      enqueue.assign({
        ...startStep(fallbackStep(context.plan, 'rest-recheck', coldWaitSeconds(context, context.lastAt, false)), context.lastAt),
        interruptedKind: context.interruptedKind ?? context.step?.kind ?? null,
      });
    }),
    startColdPack: enqueueActions(({ context, enqueue }) => {
      enqueue.assign({
        ...startStep(fallbackStep(context.plan, 'cold-pack'), context.lastAt),
        interruptedKind: context.interruptedKind ?? context.step?.kind ?? null,
      });
    }),
    startWaitBeforePlanCold: enqueueActions(({ context, enqueue }) => {
      // Skipped or quickly confirmed steps can bring the plan's next cold step closer than planned.
      const wait = fallbackStep(context.plan, 'rest-recheck', coldWaitSeconds(context, context.lastAt, false));
      enqueue.assign(startStep({ ...wait, stage: 'plan' }, context.lastAt));
    }),
    startCompression: enqueueActions(({ context, enqueue }) => {
      // Untimed: the wrap is done when the therapist says so; the plan's seconds stay on screen as a guide.
      enqueue.assign(startStep(fallbackStep(context.plan, 'compression-wrap'), context.lastAt, false));
    }),

    /** The timer ran out (or a TICK found it had): the step ran its full planned time, extensions included. */
    recordStepTimedOut: enqueueActions(({ context, enqueue }) => {
      const deadline = context.deadline ?? context.lastAt;
      const late = context.lastAt - deadline;
      commit(enqueue, context, {
        entries: [
          stepEntry('step-completed', context, deadline, {
            actualSeconds: wholeSeconds(totalMs(context)),
            ...(late >= 1000 ? { detail: `ended unseen (table mode closed or asleep); noticed ${wholeSeconds(late)} s later` } : {}),
          }),
        ],
        patch: { deadline: null, ...coldEnded(context, context.lastAt) },
      });
    }),
    recordStepConfirmed: enqueueActions(({ context, enqueue }) => {
      const now = context.lastAt;
      const entries = [stepEntry('step-completed', context, now, { actualSeconds: wholeSeconds(elapsedMs(context, now)) })];
      let patch: Partial<TreatmentRunContext> = { deadline: null };
      // Confirming a plan's rest and re-check means the therapist found the swelling no worse.
      if (context.step?.kind === 'rest-recheck' && context.step.stage === 'plan' && !context.stepSwellingIncreased) {
        entries.push(stepEntry('swelling-check', context, now, { detail: swellingCheckDetails.notIncreased }));
        patch = { ...patch, swellingChecks: context.swellingChecks + 1, lastSwelling: swellingCheckDetails.notIncreased };
      }
      commit(enqueue, context, { entries, patch });
    }),
    recordStepSkipped: enqueueActions(({ context, event, enqueue }) => {
      assertEvent(event, 'SKIP');
      const now = context.lastAt;
      commit(enqueue, context, {
        entries: [
          stepEntry('step-skipped', context, now, {
            actualSeconds: wholeSeconds(elapsedMs(context, now)),
            reason: event.reason.trim(),
            detail: context.step?.optional ? 'optional step' : 'required step',
          }),
        ],
        patch: { deadline: null, remainingMs: null, ...coldEnded(context, now) },
      });
    }),
    /** Skipping during the wait before a cold plan step skips that cold step: the wait was only for it. */
    recordWaitedStepSkipped: enqueueActions(({ context, event, enqueue }) => {
      assertEvent(event, 'SKIP');
      const index = context.currentIndex + 1;
      const step = context.plan.steps[index];
      commit(enqueue, context, {
        entries: [
          {
            type: 'step-skipped',
            stepIndex: index,
            kind: step.kind,
            plannedSeconds: step.seconds,
            actualSeconds: 0,
            at: iso(context.lastAt),
            reason: event.reason.trim(),
            detail: `${step.optional ? 'optional step' : 'required step'}; skipped while waiting before cold`,
          },
        ],
        patch: { currentIndex: index, deadline: null, remainingMs: null },
      });
    }),
    recordStepInterrupted: enqueueActions(({ context, event, enqueue }) => {
      assertEvent(event, ['SWELLING_INCREASED', 'RED_FLAG', 'FINISH_EARLY']);
      if (context.step === null) return;
      const now = context.lastAt;
      const reason =
        event.type === 'SWELLING_INCREASED'
          ? 'swelling increased'
          : event.type === 'RED_FLAG'
            ? `red flag: ${redFlagLabel(event.flag)}`
            : event.reason.trim();
      commit(enqueue, context, {
        entries: [stepEntry('step-interrupted', context, now, { actualSeconds: wholeSeconds(elapsedMs(context, now)), reason })],
        patch: coldEnded(context, now),
      });
    }),
    recordSwellingIncreased: enqueueActions(({ context, enqueue }) => {
      const entry: LogEntry = { type: 'swelling-check', at: iso(context.lastAt), detail: swellingCheckDetails.increased };
      if (context.step) {
        entry.kind = context.step.kind;
        if (context.step.index !== null) entry.stepIndex = context.step.index;
      }
      commit(enqueue, context, {
        entries: [entry],
        patch: {
          swellingChecks: context.swellingChecks + 1,
          lastSwelling: swellingCheckDetails.increased,
          stepSwellingIncreased: true,
          swellingIncreased: true,
        },
      });
    }),
    pauseStep: enqueueActions(({ context, enqueue }) => {
      const remaining = Math.max(0, (context.deadline ?? context.lastAt) - context.lastAt);
      commit(enqueue, context, {
        entries: [stepEntry('paused', context, context.lastAt, { detail: `${wholeSeconds(remaining)} s left` })],
        patch: { remainingMs: remaining, deadline: null },
      });
    }),
    resumeStep: enqueueActions(({ context, enqueue }) => {
      const remaining = context.remainingMs ?? 0;
      commit(enqueue, context, {
        entries: [stepEntry('resumed', context, context.lastAt, { detail: `${wholeSeconds(remaining)} s left` })],
        patch: { deadline: context.lastAt + remaining, remainingMs: null },
      });
    }),
    extendStep: enqueueActions(({ context, enqueue }) => {
      const step = context.step!;
      const max = maxStepSeconds(step.kind);
      const planned = step.seconds + context.extendedSeconds;
      // decisions.md: no step may be extended past its safety bound, so clip to it and say so.
      const added = Math.max(0, Math.min(extendStepSeconds, max - planned));
      const detail =
        added === 0
          ? `refused: already at the ${max} s limit`
          : added < extendStepSeconds
            ? `added ${added} s (clipped at the ${max} s limit)`
            : `added ${added} s`;
      const patch: Partial<TreatmentRunContext> = { extendedSeconds: context.extendedSeconds + added, extendRefused: added === 0 };
      if (context.remainingMs !== null) patch.remainingMs = context.remainingMs + added * 1000;
      else if (context.deadline !== null) patch.deadline = context.deadline + added * 1000;
      commit(enqueue, context, {
        entries: [stepEntry('extended', context, context.lastAt, { plannedSeconds: planned + added, detail })],
        patch,
      });
    }),

    recordRunCompleted: enqueueActions(({ context, enqueue }) => {
      commit(enqueue, context, {
        entries: [{ type: 'run-completed', at: iso(context.lastAt) }],
        patch: finished('completed', context.lastAt),
      });
    }),
    recordFellBack: enqueueActions(({ context, enqueue }) => {
      const entry: LogEntry = { type: 'run-fell-back', at: iso(context.lastAt), reason: 'swelling increased' };
      if (context.interruptedKind) entry.detail = `back to cold after ${stepKindInfo[context.interruptedKind].label.toLowerCase()}`;
      commit(enqueue, context, { entries: [entry], patch: finished('fell-back', context.lastAt) });
    }),
    /** Acute: cold and compression went on as planned, but the supervisor must hear that swelling increased. */
    recordAcuteSwellingFellBack: enqueueActions(({ context, enqueue }) => {
      commit(enqueue, context, {
        entries: [
          {
            type: 'run-fell-back',
            at: iso(context.lastAt),
            reason: 'swelling increased',
            detail: 'swelling increased in the acute phase; cold and compression went on',
          },
        ],
        patch: finished('fell-back', context.lastAt),
      });
    }),
    recordStopElevateRefer: enqueueActions(({ context, enqueue }) => {
      commit(enqueue, context, {
        entries: [
          {
            type: 'run-fell-back',
            at: iso(context.lastAt),
            reason: 'swelling increased',
            detail: 'stop, elevate, refer: cold is contraindicated',
          },
        ],
        patch: { ...finished('stop-elevate-refer', context.lastAt), interruptedKind: context.step?.kind ?? null },
      });
    }),
    recordRedFlag: enqueueActions(({ context, event, enqueue }) => {
      assertEvent(event, 'RED_FLAG');
      const entry: LogEntry = { type: 'red-flag', at: iso(context.lastAt), reason: event.flag, detail: redFlagLabel(event.flag) };
      if (context.step) {
        entry.kind = context.step.kind;
        if (context.step.index !== null) entry.stepIndex = context.step.index;
      }
      commit(enqueue, context, { entries: [entry], patch: finished('stopped-referred', context.lastAt) });
    }),
    recordEndedEarly: enqueueActions(({ context, event, enqueue }) => {
      assertEvent(event, 'FINISH_EARLY');
      commit(enqueue, context, {
        entries: [{ type: 'run-ended-early', at: iso(context.lastAt), reason: event.reason.trim() }],
        patch: finished('ended-early', context.lastAt),
      });
    }),
  },
}).createMachine({
  id: 'treatmentRun',
  context: ({ input }) => ({
    // Parsed so a stored plan from an older build gets today's defaults, and a broken one fails at once.
    plan: planSchema.parse(input.plan),
    currentIndex: -1,
    step: null,
    stepStartedAt: null,
    deadline: null,
    remainingMs: null,
    extendedSeconds: 0,
    extendRefused: false,
    lastAt: input.now ?? 0,
    logSeq: 0,
    swellingChecks: 0,
    lastSwelling: null,
    lastColdEndedAt: null,
    stepSwellingIncreased: false,
    swellingIncreased: false,
    interruptedKind: null,
    outcome: null,
    startedAt: null,
    endedAt: null,
  }),
  output: ({ context }) => ({ outcome: context.outcome }),
  initial: 'ready',
  states: {
    ready: {
      on: {
        BEGIN: [
          { guard: 'planHasNoSteps', target: 'complete', actions: ['noteTime', 'recordRunCompleted'] },
          { target: 'running', actions: ['noteTime', 'startFirstStep'] },
        ],
        RED_FLAG: { guard: 'hasFlag', target: 'stoppedReferred', actions: ['noteTime', 'recordRedFlag'] },
        FINISH_EARLY: { guard: 'hasReason', target: 'endedEarly', actions: ['noteTime', 'recordEndedEarly'] },
        TICK: { actions: 'noteTime' },
      },
    },
    running: {
      initial: 'inStep',
      on: {
        RED_FLAG: {
          guard: 'hasFlag',
          target: 'stoppedReferred',
          actions: ['noteTime', 'recordStepInterrupted', 'recordRedFlag'],
        },
        FINISH_EARLY: {
          guard: 'hasReason',
          target: 'endedEarly',
          actions: ['noteTime', 'recordStepInterrupted', 'recordEndedEarly'],
        },
        SWELLING_INCREASED: [
          {
            guard: 'isColdContraindicated',
            target: 'stopElevateRefer',
            actions: ['noteTime', 'recordStepInterrupted', 'recordSwellingIncreased', 'recordStopElevateRefer'],
          },
          // Acute: the plan is already cold and compression, so keep going and log the finding, once per step;
          // the run then ends as a fall back so the supervisor is alerted.
          { guard: and(['isAcutePhase', 'isSwellingAlreadyIncreasedThisStep']), actions: 'noteTime' },
          { guard: 'isAcutePhase', actions: ['noteTime', 'recordSwellingIncreased'] },
          // Any step, not only hands-on ones: the swelling check itself is a rest, and is where it is found.
          // A wait comes first after a cold step, so cold never runs on past its bound.
          {
            guard: 'needsWaitBeforeCold',
            target: 'backToCold.waitBeforeCold',
            actions: ['noteTime', 'recordStepInterrupted', 'recordSwellingIncreased', 'startWaitBeforeCold'],
          },
          {
            target: 'backToCold.coldPack',
            actions: ['noteTime', 'recordStepInterrupted', 'recordSwellingIncreased', 'startColdPack'],
          },
        ],
        SKIP: { guard: 'hasReason', target: '.advance', actions: ['noteTime', 'recordStepSkipped'] },
      },
      states: {
        inStep: {
          after: {
            stepTimer: [
              { guard: 'stepNeedsConfirm', target: 'awaitingConfirm', actions: 'noteTime' },
              { target: 'advance', actions: ['noteTime', 'recordStepTimedOut'] },
            ],
          },
          on: {
            TICK: [
              { guard: and(['isDeadlinePassed', 'stepNeedsConfirm']), target: 'awaitingConfirm', actions: 'noteTime' },
              { guard: 'isDeadlinePassed', target: 'advance', actions: ['noteTime', 'recordStepTimedOut'] },
              { target: 'inStep', reenter: true, actions: 'noteTime' },
            ],
            PAUSE: { guard: 'canPause', target: 'paused', actions: ['noteTime', 'pauseStep'] },
            EXTEND: { target: 'inStep', reenter: true, actions: ['noteTime', 'extendStep'] },
            // The wrap or the re-check may be done before its guide time runs out.
            NEXT: { guard: 'stepNeedsConfirm', target: 'advance', actions: ['noteTime', 'recordStepConfirmed'] },
          },
        },
        awaitingConfirm: {
          on: {
            NEXT: { target: 'advance', actions: ['noteTime', 'recordStepConfirmed'] },
            TICK: { actions: 'noteTime' },
          },
        },
        paused: {
          on: {
            RESUME: { target: 'inStep', actions: ['noteTime', 'resumeStep'] },
            EXTEND: { actions: ['noteTime', 'extendStep'] },
            TICK: { actions: 'noteTime' },
          },
        },
        // Treatment rule 2 at run time: no pause, no extension; skipping skips the cold step it waits for.
        waitBeforeCold: {
          after: { stepTimer: { target: 'inStep', actions: ['noteTime', 'recordStepTimedOut', 'startNextStep'] } },
          on: {
            TICK: [
              { guard: 'isDeadlinePassed', target: 'inStep', actions: ['noteTime', 'recordStepTimedOut', 'startNextStep'] },
              { target: 'waitBeforeCold', reenter: true, actions: 'noteTime' },
            ],
            SKIP: { guard: 'hasReason', target: 'advance', actions: ['noteTime', 'recordWaitedStepSkipped'] },
          },
        },
        advance: {
          always: [
            { guard: and(['hasNextStep', 'nextPlanStepMustWait']), target: 'waitBeforeCold', actions: 'startWaitBeforePlanCold' },
            { guard: 'hasNextStep', target: 'inStep', actions: 'startNextStep' },
            { guard: 'hasSwellingIncreased', target: '#treatmentRun.fellBack', actions: 'recordAcuteSwellingFellBack' },
            { target: '#treatmentRun.complete', actions: 'recordRunCompleted' },
          ],
        },
      },
    },
    backToCold: {
      // Entered through an explicit child; coldPack is the entry when nothing says to wait first.
      initial: 'coldPack',
      // No pause or skip here: cold keeps working on the limb whatever the screen shows.
      on: {
        RED_FLAG: {
          guard: 'hasFlag',
          target: 'stoppedReferred',
          actions: ['noteTime', 'recordStepInterrupted', 'recordRedFlag'],
        },
        FINISH_EARLY: {
          guard: 'hasReason',
          target: 'endedEarly',
          actions: ['noteTime', 'recordStepInterrupted', 'recordEndedEarly'],
        },
        SWELLING_INCREASED: { actions: ['noteTime', 'recordSwellingIncreased'] },
      },
      onDone: { target: 'fellBack', actions: 'recordFellBack' },
      states: {
        waitBeforeCold: timedBackToColdStep('waitBeforeCold', 'coldPack', 'startColdPack'),
        coldPack: timedBackToColdStep('coldPack', 'compression', 'startCompression'),
        compression: {
          on: {
            NEXT: { target: 'done', actions: ['noteTime', 'recordStepConfirmed'] },
            TICK: { actions: 'noteTime' },
          },
        },
        done: { type: 'final' },
      },
    },
    complete: { type: 'final' },
    fellBack: { type: 'final' },
    stopElevateRefer: { type: 'final' },
    stoppedReferred: { type: 'final' },
    endedEarly: { type: 'final' },
  },
});

export type TreatmentRunSnapshot = SnapshotFrom<typeof treatmentRunMachine>;

/** Milliseconds left on the current step's countdown at `now`; null when nothing is counting down. */
export function remainingMs(snapshot: TreatmentRunSnapshot, now: number): number | null {
  if (snapshot.status !== 'active') return null;
  const { remainingMs: paused, deadline } = snapshot.context;
  if (paused !== null) return paused;
  if (deadline !== null) return Math.max(0, deadline - now);
  return null;
}

/** The step table mode shows now, from the plan or from back to cold; null before BEGIN and after the end. */
export function currentStep(snapshot: TreatmentRunSnapshot): RunStep | null {
  if (snapshot.status !== 'active' || snapshot.matches('ready')) return null;
  return snapshot.context.step;
}

/** The plan step after the current one, for table mode's "next" line; null in back to cold and at the end. */
export function nextStep(snapshot: TreatmentRunSnapshot): PlanStep | null {
  if (snapshot.status !== 'active' || snapshot.matches('backToCold')) return null;
  return snapshot.context.plan.steps[snapshot.context.currentIndex + 1] ?? null;
}
