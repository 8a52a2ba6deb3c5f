import { createActor, SimulatedClock } from 'xstate';
import { buildPlan, type BuildPlanArgs, type Plan } from '../../shared/plan/build-plan';
import { defaultSequences } from '../../shared/plan/sequence';
import type { Phase } from '../../shared/phase';
import {
  treatmentRunMachine,
  type LogEmitted,
  type TreatmentRunEvent,
  type TreatmentRunSnapshot,
} from '../../machines/treatment-run';

/** A fixed, realistic start so logged instants read as real dates. */
export const T0 = Date.parse('2025-03-30T09:00:00.000Z');
export const second = 1000;
export const minute = 60 * second;

type WithoutAt<E> = E extends unknown ? Omit<E, 'at'> : never;
export type UiEvent = WithoutAt<TreatmentRunEvent>;

export function planFor(phase: Phase, overrides: Partial<Omit<BuildPlanArgs, 'phase'>> = {}): Plan {
  return buildPlan({
    phase,
    sequence: defaultSequences[phase],
    tolerance: 'usual',
    padSize: null,
    coldContraindicated: false,
    suspectedMyositis: false,
    ...overrides,
  });
}

function harness(actor: ReturnType<typeof createActor<typeof treatmentRunMachine>>, clock: SimulatedClock) {
  const log: LogEmitted[] = [];
  actor.on('log', (emitted) => log.push(emitted));
  actor.start();
  return {
    actor,
    clock,
    log,
    /** Sends what the UI sends: the event stamped with the clock's now. */
    send(event: UiEvent) {
      actor.send({ ...event, at: clock.now() } as TreatmentRunEvent);
    },
    advance(ms: number) {
      clock.increment(ms);
    },
    /**
     * Lets steps run one after another in real time. One big increment would be a sleeping tablet instead:
     * the timer fires late, once, at the end of the jump.
     */
    advanceSteps(...seconds: number[]) {
      for (const s of seconds) clock.increment(s * 1000);
    },
    snapshot(): TreatmentRunSnapshot {
      return actor.getSnapshot();
    },
    entries() {
      return log.map((emitted) => emitted.entry);
    },
  };
}

export type Harness = ReturnType<typeof harness>;

export function startRun(plan: Plan, at = T0): Harness {
  const clock = new SimulatedClock();
  clock.set(at);
  return harness(createActor(treatmentRunMachine, { input: { plan, now: at }, clock }), clock);
}

/** What a reload does: the stored snapshot goes through JSON, into a new actor on a new clock. */
export function restoreRun(stored: Harness, at: number): Harness {
  const persisted = JSON.parse(JSON.stringify(stored.actor.getPersistedSnapshot()));
  stored.actor.stop();
  const clock = new SimulatedClock();
  clock.set(at);
  // The input is ignored when a snapshot is given; TypeScript still asks for it.
  const input = { plan: persisted.context.plan };
  return harness(createActor(treatmentRunMachine, { snapshot: persisted, input, clock }), clock);
}
