import {
  cuesBetween,
  cuesDue,
  cuesDueAt,
  observeRun,
  staleCueMs,
  type CueStep,
  type DueCue,
  type RunObservation,
} from '../../../src/features/table-mode/lib/cue-schedule';
import { minute, planFor, restoreRun, second, startRun, T0, type Harness } from '../../support/run-harness';

/** A small seeded generator, so the irregular looks are the same on every run. */
function seeded(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

function step(startedAt: number, seconds: number, needsConfirm = false): CueStep {
  return { startedAt, seconds, needsConfirm };
}

/** Looks at one step from `from` to `to` every `every()` ms, as table mode would, collecting what falls due. */
function lookAtStep(s: CueStep, deadline: number, from: number, to: number, every: () => number): DueCue[] {
  const heard: DueCue[] = [];
  let previousNow = from;
  while (previousNow < to) {
    const now = Math.min(to, previousNow + every());
    heard.push(...cuesDueAt({ step: s, deadline, previousNow, now }));
    previousNow = now;
  }
  return heard;
}

describe('cue schedule for one step', () => {
  it('a three-minute step looked at four times a second gets its start, one minute left, five ticks and its end, each once and on time', () => {
    const start = T0;
    const deadline = start + 180 * second;

    const heard = lookAtStep(step(start, 180), deadline, start - 250, deadline + second, () => 250);

    expect(heard).toEqual([
      { cue: 'step-start', dueAt: start },
      { cue: 'one-minute', dueAt: deadline - minute },
      { cue: 'final-five', dueAt: deadline - 5 * second },
      { cue: 'final-five', dueAt: deadline - 4 * second },
      { cue: 'final-five', dueAt: deadline - 3 * second },
      { cue: 'final-five', dueAt: deadline - 2 * second },
      { cue: 'final-five', dueAt: deadline - 1 * second },
      { cue: 'step-end', dueAt: deadline },
    ]);
  });

  it('a 45-minute run of steps looked at irregularly hears every cue at its exact time, with no drift', () => {
    const lengths = [1200, 180, 300, 360, 300, 180, 180]; // 2700 s = 45 min
    const random = seeded(7);
    let start = T0;
    const expected: DueCue[] = [];
    const heard: DueCue[] = [];
    for (const seconds of lengths) {
      const deadline = start + seconds * second;
      expected.push({ cue: 'step-start', dueAt: start });
      if (seconds > 90) expected.push({ cue: 'one-minute', dueAt: deadline - minute });
      for (let left = 5; left >= 1; left--) expected.push({ cue: 'final-five', dueAt: deadline - left * second });
      expected.push({ cue: 'step-end', dueAt: deadline });
      // Looks between 40 ms and 900 ms apart: an animation loop under load.
      heard.push(...lookAtStep(step(start, seconds), deadline, start - 1, deadline, () => 40 + Math.floor(random() * 860)));
      start = deadline;
    }

    expect(heard).toEqual(expected);
    expect(heard.at(-1)!.dueAt - T0).toBe(45 * minute);
  });

  it('a step of 90 s has no "one minute left"; a step of 91 s has one', () => {
    const at90 = lookAtStep(step(T0, 90), T0 + 90 * second, T0 - 1, T0 + 90 * second, () => 100);
    const at91 = lookAtStep(step(T0, 91), T0 + 91 * second, T0 - 1, T0 + 91 * second, () => 100);

    expect(at90.map((d) => d.cue)).not.toContain('one-minute');
    expect(at91.filter((d) => d.cue === 'one-minute')).toEqual([{ cue: 'one-minute', dueAt: T0 + 31 * second }]);
  });

  it('a step that waits for the therapist ends with needs-you instead of step-end', () => {
    const deadline = T0 + 180 * second;

    const names = cuesDue({ step: step(T0, 180, true), deadline, previousNow: deadline - 100, now: deadline + 100 });

    expect(names).toEqual(['needs-you']);
  });

  it('a cue due exactly at a look is heard at that look and not again at the next', () => {
    const deadline = T0 + 180 * second;
    const s = step(T0, 180);

    const first = cuesDue({ step: s, deadline, previousNow: deadline - 400, now: deadline });
    const second_ = cuesDue({ step: s, deadline, previousNow: deadline, now: deadline + 400 });

    expect(first).toEqual(['step-end']);
    expect(second_).toEqual([]);
  });

  it('after the tab was hidden, a look 2.2 s before the end plays only the latest fresh tick, not a burst', () => {
    const deadline = T0 + 180 * second;

    const due = cuesDueAt({ step: step(T0, 180), deadline, previousNow: deadline - 30 * second, now: deadline - 2200 });

    expect(due).toEqual([{ cue: 'final-five', dueAt: deadline - 3 * second }]);
  });

  it('after the tab was hidden past the end, only the (late) end plays: no stale minute warning, no ticks', () => {
    const deadline = T0 + 180 * second;

    const due = cuesDueAt({ step: step(T0, 180), deadline, previousNow: deadline - 70 * second, now: deadline + 10 * second });

    expect(due).toEqual([{ cue: 'step-end', dueAt: deadline }]);
  });

  it(`a "one minute left" more than ${staleCueMs} ms old is dropped, one just inside is kept`, () => {
    const deadline = T0 + 180 * second;
    const oneMinute = deadline - minute;
    const s = step(T0, 180);

    expect(cuesDue({ step: s, deadline, previousNow: oneMinute - 1, now: oneMinute + staleCueMs + 1 })).toEqual([]);
    expect(cuesDue({ step: s, deadline, previousNow: oneMinute - 1, now: oneMinute + staleCueMs })).toEqual(['one-minute']);
  });

  it('a paused step (no deadline) counts nothing down', () => {
    const due = cuesDue({ step: step(T0, 180), deadline: null, previousNow: T0 + 10 * second, now: T0 + 10 * minute });

    expect(due).toEqual([]);
  });

  it('a look that is not later than the previous one hears nothing, even if the clock went back', () => {
    const deadline = T0 + 180 * second;
    const s = step(T0, 180);

    expect(cuesDue({ step: s, deadline, previousNow: deadline, now: deadline })).toEqual([]);
    expect(cuesDue({ step: s, deadline, previousNow: deadline + 1000, now: deadline - 3000 })).toEqual([]);
  });

  it('ticks never fall before the step began, even in a step shorter than five seconds', () => {
    const due = lookAtStep(step(T0, 3), T0 + 3 * second, T0 - 1, T0 + 3 * second, () => 100);

    expect(due.map((d) => d.cue)).toEqual(['step-start', 'final-five', 'final-five', 'step-end']);
  });
});

/** Looks at a real treatment run on its simulated clock every `every` ms for `ms`, like table mode's loop. */
function watch(run: Harness, ms: number, every = 250, previous: RunObservation | null = null) {
  const heard: DueCue[] = [];
  let last = previous ?? observeRun(run.snapshot(), run.clock.now());
  const end = run.clock.now() + ms;
  while (run.clock.now() < end) {
    run.advance(Math.min(every, end - run.clock.now()));
    const look = observeRun(run.snapshot(), run.clock.now());
    heard.push(...cuesBetween(last, look));
    last = look;
  }
  return { heard, last };
}

const names = (due: DueCue[]) => due.map((d) => d.cue);
const ticks = (n: number) => Array.from({ length: n }, () => 'final-five');

describe('cues between looks at a treatment run', () => {
  it('an acute run plays its steps\' cues, calls the therapist at the wrap and the re-check, and ends with run-complete', () => {
    // Acute: cold pack 1200 s, compression wrap 180 s (confirmed), rest and re-check 300 s (confirmed).
    const run = startRun(planFor('acute'));
    let last = observeRun(run.snapshot(), run.clock.now());
    run.send({ type: 'BEGIN' });

    const cold = watch(run, 1200 * second, 250, last);
    const wrap = watch(run, 180 * second + 500, 250, cold.last);
    run.send({ type: 'NEXT' });
    const recheck = watch(run, 300 * second + 500, 250, wrap.last);
    run.send({ type: 'NEXT' });
    last = observeRun(run.snapshot(), run.clock.now());
    const end = cuesBetween(recheck.last, last);

    expect(names(cold.heard)).toEqual(['step-start', 'one-minute', ...ticks(5), 'step-end']);
    // The wrap's start is announced by the cold pack's end, so it has no start cue of its own.
    expect(names(wrap.heard)).toEqual(['one-minute', ...ticks(5), 'needs-you']);
    // The re-check starts on a tap, so its start cue plays.
    expect(names(recheck.heard)).toEqual(['step-start', 'one-minute', ...ticks(5), 'needs-you']);
    expect(names(end)).toEqual(['run-complete']);
  });

  it('each step end is heard at the very time the log records the step ending', () => {
    const run = startRun(planFor('remodelling'));
    const last = observeRun(run.snapshot(), run.clock.now());
    run.send({ type: 'BEGIN' });
    const total = run.snapshot().context.plan.steps.reduce((sum, s) => sum + s.seconds, 0);

    const { heard } = watch(run, total * second + second, 250, last);

    const ends = heard.filter((d) => d.cue === 'step-end' || d.cue === 'run-complete').map((d) => d.dueAt);
    const logged = run.entries().filter((e) => e.type === 'step-completed').map((e) => Date.parse(e.at));
    expect(logged.length).toBe(run.snapshot().context.plan.steps.length);
    // The final step's end coincides with the run's end, whose cue replaces it.
    expect(ends).toEqual(logged);
    expect(names(heard).at(-1)).toBe('run-complete');
    expect(names(heard).filter((n) => n === 'step-start')).toEqual(['step-start']);
  });

  it('"swelling has increased" during warm-up strokes plays back-to-cold once, not a step start', () => {
    // No cold before it, so the cold pack starts at once (treatment rule 2 waits only after cold).
    const run = startRun(planFor('remodelling'));
    run.send({ type: 'BEGIN' });
    const before = watch(run, 30 * second);

    run.send({ type: 'SWELLING_INCREASED' });
    const look = observeRun(run.snapshot(), run.clock.now() + 100);
    const due = cuesBetween(before.last, look);

    expect(run.snapshot().matches({ backToCold: 'coldPack' })).toBe(true);
    expect(due).toEqual([{ cue: 'back-to-cold', dueAt: run.clock.now() }]);
  });

  it('a fall back where cold is not allowed calls the therapist at once', () => {
    const run = startRun(planFor('proliferative', { coldContraindicated: true }));
    run.send({ type: 'BEGIN' });
    const before = watch(run, 30 * second);

    run.send({ type: 'SWELLING_INCREASED' });
    const due = cuesBetween(before.last, observeRun(run.snapshot(), run.clock.now() + 100));

    expect(run.snapshot().matches('stopElevateRefer')).toBe(true);
    expect(names(due)).toEqual(['needs-you']);
  });

  it('a run the therapist ends early plays nothing', () => {
    const run = startRun(planFor('remodelling'));
    run.send({ type: 'BEGIN' });
    const before = watch(run, 30 * second);

    run.send({ type: 'FINISH_EARLY', reason: 'athlete called to the pitch' });
    const due = cuesBetween(before.last, observeRun(run.snapshot(), run.clock.now() + 100));

    expect(run.snapshot().status).toBe('done');
    expect(due).toEqual([]);
  });

  it('a skipped step gives way without its end cue, and the next step starts with its own', () => {
    const run = startRun(planFor('remodelling'));
    run.send({ type: 'BEGIN' });
    const before = watch(run, 20 * second);

    run.send({ type: 'SKIP', reason: 'athlete already warm' });
    const due = cuesBetween(before.last, observeRun(run.snapshot(), run.clock.now() + 100));

    expect(due).toEqual([{ cue: 'step-start', dueAt: run.clock.now() }]);
  });

  it('a look at the very deadline, before the timer has moved the run on, hears the end once and no start after it', () => {
    const deadline = T0 + 180 * second;
    const look = (now: number, stepId: string, s: CueStep, dl: number): RunObservation => ({
      now,
      stepId,
      step: s,
      deadline: dl,
      stage: 'plan',
      outcome: null,
      endedAt: null,
    });
    const before = look(deadline - 250, 'a', step(T0, 180), deadline);
    const atDeadline = look(deadline, 'a', step(T0, 180), deadline);
    const next = look(deadline + 250, 'b', step(deadline + 2, 120), deadline + 2 + 120 * second);

    const first = cuesBetween(before, atDeadline);
    const then = cuesBetween(atDeadline, next);

    expect(first).toEqual([{ cue: 'step-end', dueAt: deadline }]);
    expect(then).toEqual([]);
  });

  it('reopening table mode mid-step plays nothing on the first look', () => {
    const run = startRun(planFor('remodelling'));
    run.send({ type: 'BEGIN' });
    run.advance(2 * minute);
    const restored = restoreRun(run, run.clock.now() + 10 * second);
    restored.send({ type: 'TICK' });

    const due = cuesBetween(null, observeRun(restored.snapshot(), restored.clock.now() + 50));

    expect(due).toEqual([]);
  });

  it('reopening after the tablet slept through a step end starts the next step with its start cue only', () => {
    const run = startRun(planFor('remodelling'));
    run.send({ type: 'BEGIN' });
    const firstSeconds = run.snapshot().context.plan.steps[0].seconds;
    const restored = restoreRun(run, T0 + firstSeconds * second + 3 * minute);
    restored.send({ type: 'TICK' });

    const due = cuesBetween(null, observeRun(restored.snapshot(), restored.clock.now() + 50));

    expect(restored.snapshot().context.currentIndex).toBe(1);
    expect(due).toEqual([{ cue: 'step-start', dueAt: restored.clock.now() }]);
  });

  it('a pause stops the countdown cues and a resume picks them up at the new times', () => {
    const run = startRun(planFor('remodelling'));
    const ready = observeRun(run.snapshot(), run.clock.now());
    run.send({ type: 'BEGIN' });
    const first = run.snapshot().context.plan.steps[0];
    const before = watch(run, (first.seconds - 30) * second, 250, ready);

    run.send({ type: 'PAUSE' });
    const paused = watch(run, 5 * minute, 250, before.last);
    run.send({ type: 'RESUME' });
    const resumedAt = run.clock.now();
    const after = watch(run, 31 * second, 250, paused.last);

    expect(names(before.heard)).toEqual(['step-start', 'one-minute']);
    expect(paused.heard).toEqual([]);
    expect(names(after.heard)).toEqual([...ticks(5), 'step-end']);
    expect(after.heard.at(-1)!.dueAt).toBe(resumedAt + 30 * second);
  });
});
