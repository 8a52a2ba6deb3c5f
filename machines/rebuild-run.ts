import { createActor, SimulatedClock } from 'xstate';
import type { Plan } from '../shared/plan/build-plan';
import type { LogEntry } from '../shared/runs/log-entry';
import { treatmentRunMachine, type TreatmentRunEvent } from './treatment-run';

type StoredEntry = LogEntry & { seq?: number | null };

/**
 * Rebuilds a run's machine from the server's log, for a tablet that lost its storage mid-run (decisions:
 * "rebuilt from the server's log"). The machine is deterministic in its events' times, so replaying the
 * events the entries stand for, on a simulated clock that walks from deadline to deadline as the real one
 * did, arrives where the run was when the last entry was written. The result is a persisted snapshot to
 * restore with the wall clock, followed by a TICK, like any other restore.
 *
 * Timer-driven completions need no event: walking the clock past a step's deadline completes it again.
 * Entries that a later entry explains (the interruption before a red flag or an early end, the run's own
 * end) are skipped, since their event comes with the later entry.
 */
export function rebuildRunSnapshot(plan: Plan, stored: readonly StoredEntry[]) {
  const entries = [...stored].sort((a, b) => (a.seq ?? Infinity) - (b.seq ?? Infinity) || Date.parse(a.at) - Date.parse(b.at));
  const first = entries[0];
  const firstAt = first ? Date.parse(first.at) : Date.now();
  // The first entry closes the first step at the earliest; the run began that step's length before it.
  const beginAt = first && first.stepIndex === 0 && first.actualSeconds !== undefined ? firstAt - first.actualSeconds * 1000 : firstAt;

  const clock = new SimulatedClock();
  clock.set(beginAt);
  const actor = createActor(treatmentRunMachine, { input: { plan, now: beginAt }, clock });
  actor.start();
  actor.send({ type: 'BEGIN', at: beginAt });

  /** Moves the clock to `target`, stopping at each deadline on the way so steps end when they did. */
  const walkTo = (target: number) => {
    for (let guard = 0; guard < 200; guard++) {
      const deadline = actor.getSnapshot().context.deadline;
      if (deadline === null || deadline > target || deadline <= clock.now()) break;
      clock.increment(deadline - clock.now());
    }
    if (target > clock.now()) clock.increment(target - clock.now());
  };

  let lastSwellingAt: number | null = null;
  for (const entry of entries) {
    const at = Date.parse(entry.at);
    walkTo(at);
    const state = actor.getSnapshot();
    let event: TreatmentRunEvent | null = null;
    switch (entry.type) {
      case 'step-completed':
        // A confirmed step ended by NEXT; a timed one has already ended on the walk.
        if (state.context.step && state.context.step.index === (entry.stepIndex ?? null) && state.context.deadline === null) {
          event = { type: 'NEXT', at };
        }
        break;
      case 'step-skipped':
        event = { type: 'SKIP', at, reason: entry.reason ?? 'skipped' };
        break;
      case 'step-interrupted':
        if (entry.reason === 'swelling increased') event = { type: 'SWELLING_INCREASED', at };
        break;
      case 'swelling-check':
        if (entry.detail === 'increased' && lastSwellingAt !== at) event = { type: 'SWELLING_INCREASED', at };
        else if (state.context.deadline === null && state.context.step?.needsConfirm) event = { type: 'NEXT', at };
        break;
      case 'paused':
        event = { type: 'PAUSE', at };
        break;
      case 'resumed':
        event = { type: 'RESUME', at };
        break;
      case 'extended':
        event = { type: 'EXTEND', at };
        break;
      case 'red-flag':
        event = { type: 'RED_FLAG', at, flag: entry.reason ?? 'red flag' };
        break;
      case 'run-ended-early':
        event = { type: 'FINISH_EARLY', at, reason: entry.reason ?? 'ended early' };
        break;
      default:
        break;
    }
    if (event) {
      if (event.type === 'SWELLING_INCREASED') lastSwellingAt = at;
      actor.send(event);
    }
  }
  const snapshot = actor.getPersistedSnapshot();
  actor.stop();
  return snapshot;
}
