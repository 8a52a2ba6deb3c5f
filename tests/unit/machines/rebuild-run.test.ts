import { createActor } from 'xstate';
import { describe, expect, it } from 'vitest';
import { rebuildRunSnapshot } from '../../../machines/rebuild-run';
import { treatmentRunMachine, wallClock } from '../../../machines/treatment-run';
import { minute, planFor, second, startRun, type Harness } from '../../support/run-harness';

/** What a tablet that kept its storage would hold, against what one rebuilt from the server's log holds. */
function compare(original: Harness) {
  const plan = original.snapshot().context.plan;
  const rebuilt = rebuildRunSnapshot(plan, original.log.map((l) => ({ ...l.entry, seq: l.seq }))) as ReturnType<typeof original.actor.getPersistedSnapshot> & {
    value: unknown;
    context: ReturnType<typeof original.snapshot>['context'];
  };
  const live = original.snapshot();
  return { live, rebuilt };
}

describe('rebuilding a run from the server log', () => {
  it('arrives at the same step with the same deadline after steps completed, a pause and an extension', () => {
    const run = startRun(planFor('proliferative'));
    run.send({ type: 'BEGIN' });
    run.advanceSteps(360); // ice massage ends
    run.advance(30 * second);
    run.send({ type: 'PAUSE' });
    run.advance(2 * minute);
    run.send({ type: 'RESUME' });
    run.send({ type: 'EXTEND' });
    run.advance(10 * second);
    run.send({ type: 'SKIP', reason: 'athlete asked to move on' });

    const { live, rebuilt } = compare(run);
    // Guard against comparing two broken runs: the live one really is on a later step.
    expect(live.context.currentIndex).toBeGreaterThan(1);
    expect(live.status).toBe('active');
    expect(rebuilt.value).toEqual(live.value);
    expect(rebuilt.context.currentIndex).toBe(live.context.currentIndex);
    expect(rebuilt.context.deadline).toBe(live.context.deadline);
  });

  it('arrives in back to cold after swelling increased during a hands-on step', () => {
    const run = startRun(planFor('proliferative'));
    run.send({ type: 'BEGIN' });
    run.advanceSteps(360, 60);
    run.send({ type: 'SWELLING_INCREASED' });
    const { live, rebuilt } = compare(run);
    expect(live.matches('backToCold')).toBe(true);
    expect(rebuilt.value).toEqual(live.value);
    expect(rebuilt.context.deadline).toBe(live.context.deadline);
  });

  it('gives a snapshot that restores with the wall clock', () => {
    const run = startRun(planFor('remodelling'));
    run.send({ type: 'BEGIN' });
    run.advanceSteps(120);
    const snapshot = rebuildRunSnapshot(run.snapshot().context.plan, run.log.map((l) => ({ ...l.entry, seq: l.seq })));
    const restored = createActor(treatmentRunMachine, { snapshot, input: { plan: run.snapshot().context.plan }, clock: wallClock });
    restored.start();
    expect(restored.getSnapshot().context.currentIndex).toBe(run.snapshot().context.currentIndex);
    restored.stop();
  });

  it('with an empty log starts at the first step', () => {
    const snapshot = rebuildRunSnapshot(planFor('acute'), []) as unknown as { context: { currentIndex: number } };
    expect(snapshot.context.currentIndex).toBe(0);
  });
});
