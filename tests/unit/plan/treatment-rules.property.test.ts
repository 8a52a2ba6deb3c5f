import fc from 'fast-check';
import { createActor, SimulatedClock } from 'xstate';
import { treatmentRunMachine, type TreatmentRunEvent } from '../../../machines/treatment-run';
import { phases, type Phase } from '../../../shared/phase';
import { buildPlan, type Plan } from '../../../shared/plan/build-plan';
import { sequenceSchema, type Sequence } from '../../../shared/plan/sequence';
import { stepKinds, stepKindInfo, type StepKind } from '../../../shared/plan/step-kinds';
import { stepRuleIssues } from '../../../shared/plan/treatment-rules';
import { logEntrySchema, type LogEntry } from '../../../shared/runs/log-entry';
import { coldContraindications, massageCautions, redFlags, screeningOutcome } from '../../../shared/runs/screening';

/*
 * The treatment rules (decision record 0100), checked over random input with checkers of their own — they
 * do not call the rules module, so a bug there cannot hide itself. Check values:
 *  - no continuous cold over 20 minutes (1200 s): common practice;
 *  - ice massage 300–420 s (5–7 min at a time): common practice;
 *  - the minimum interval between cold steps: the clinic's setting, 1–60 min (decisions.md, default 10 min);
 *  - no massage in the acute phase ("no massage for 24–72 h"): common practice;
 *  - no deep work with suspected myositis ossificans (Phys Sportsmed 1995;23(2):77–82, authors and title not
 *    retrieved), anticoagulants or a bleeding disorder, or open skin (massage cautions, common practice);
 *  - a red flag stops the run and refers (Tintinalli's Emergency Medicine, chapter on compartment syndrome).
 */

const maxColdMs = 1200 * 1000;
const cold = (kind: StepKind) => stepKindInfo[kind].cold;
const deep = (kind: StepKind) => stepKindInfo[kind].deepWork;
const massage = (kind: StepKind) => stepKindInfo[kind].massage;

/** Planned cold applications as [start, end] seconds from the plan's start, if every step ran its planned time. */
function plannedColdSpans(steps: readonly { kind: StepKind; seconds: number }[]): [number, number][] {
  const spans: [number, number][] = [];
  let t = 0;
  for (const step of steps) {
    if (cold(step.kind)) spans.push([t, t + step.seconds]);
    t += step.seconds;
  }
  return spans;
}

function assertPlannedCold(steps: readonly { kind: StepKind; seconds: number }[], intervalSeconds: number) {
  const spans = plannedColdSpans(steps);
  spans.forEach(([start, end], i) => {
    expect(end - start).toBeLessThanOrEqual(1200);
    if (i > 0) expect(start - spans[i - 1][1]).toBeGreaterThanOrEqual(intervalSeconds);
  });
  for (const step of steps) {
    if (step.kind === 'ice-massage') {
      expect(step.seconds).toBeGreaterThanOrEqual(300);
      expect(step.seconds).toBeLessThanOrEqual(420);
    }
  }
}

const anyStep = fc.record({
  kind: fc.constantFrom(...stepKinds),
  seconds: fc.integer({ min: 1, max: 1500 }),
  optional: fc.boolean(),
});
// Steps inside their kind's bounds, so that many random sequences get past the bounds to the rules.
const boundedStep = fc.constantFrom(...stepKinds).chain((kind) =>
  fc.record({
    kind: fc.constant(kind),
    seconds: fc.integer(stepKindInfo[kind].bounds),
    optional: fc.boolean(),
  }),
);
const phase = fc.constantFrom(...phases);
const interval = fc.integer({ min: 1, max: 60 }).map((minutes) => minutes * 60);

// Nothing ticked is the common case: each list is empty two times in three, so cold and deep work stay in often.
const subset = <T,>(items: readonly T[]) =>
  fc.oneof({ weight: 2, arbitrary: fc.constant<T[]>([]) }, { weight: 1, arbitrary: fc.subarray([...items], { minLength: 1 }) });
const screening = fc.record({
  redFlags: subset(redFlags.map((f) => f.id)),
  coldContraindications: subset(coldContraindications.map((c) => c.id)),
  massageCautions: subset(massageCautions.map((c) => c.id)),
  tolerance: fc.constantFrom('light' as const, 'usual' as const),
});
type ScreeningAnswers = typeof screening extends fc.Arbitrary<infer T> ? T : never;

function planFrom(p: Phase, steps: Sequence['steps'], answers: ScreeningAnswers, intervalSeconds: number): Plan {
  const outcome = screeningOutcome(answers);
  return buildPlan({
    phase: p,
    // An old sequence saved before today's rules may break them: buildPlan must still return a safe plan.
    sequence: { phase: p, steps },
    tolerance: answers.tolerance,
    coldContraindicated: outcome.coldContraindicated,
    suspectedMyositis: outcome.suspectedMyositis,
    bleedingRisk: outcome.bleedingRisk,
    openSkin: outcome.openSkin,
    minColdIntervalSeconds: intervalSeconds,
  });
}

describe('the treatment rules hold for any input', () => {
  it('every sequence the schema accepts keeps the cold rules and keeps massage out of acute', () => {
    fc.assert(
      fc.property(phase, fc.array(fc.oneof(anyStep, boundedStep), { minLength: 1, maxLength: 12 }), (p, steps) => {
        const result = sequenceSchema.safeParse({ phase: p, steps });
        if (!result.success) return;
        // The schema checks the shortest interval a clinic may set: one minute.
        assertPlannedCold(result.data.steps, 60);
        if (p === 'acute') expect(result.data.steps.filter((s) => massage(s.kind))).toEqual([]);
      }),
      { numRuns: 500 },
    );
  });

  it("every sequence the clinic's own interval accepts keeps that interval between cold steps", () => {
    fc.assert(
      fc.property(phase, fc.array(boundedStep, { minLength: 1, maxLength: 12 }), interval, (p, steps, seconds) => {
        if (stepRuleIssues(p, steps, seconds).length > 0) return;
        assertPlannedCold(steps, seconds);
      }),
      { numRuns: 500 },
    );
  });

  it('every plan buildPlan returns keeps the cold rules and the screening, and says what it left out', () => {
    fc.assert(
      fc.property(phase, fc.array(boundedStep, { minLength: 1, maxLength: 12 }), screening, interval, (p, steps, answers, seconds) => {
        const plan = planFrom(p, steps, answers, seconds);
        assertPlannedCold(plan.steps, seconds);
        const kinds = plan.steps.map((s) => s.kind);
        if (p === 'acute') expect(kinds.filter(massage)).toEqual([]);
        if (answers.coldContraindications.length > 0) expect(kinds.filter(cold)).toEqual([]);
        if (answers.massageCautions.length > 0) expect(kinds.filter(deep)).toEqual([]);
        if (plan.steps.length < steps.length) expect(plan.cautions.some((c) => c.startsWith('Left out of this plan'))).toBe(true);
      }),
      { numRuns: 400 },
    );
  });

  it('a red flag at screening always refers', () => {
    fc.assert(
      fc.property(screening, (answers) => {
        expect(screeningOutcome(answers).outcome === 'refer').toBe(answers.redFlags.length > 0);
      }),
    );
  });

  const uiEvent = fc.oneof(
    { weight: 6, arbitrary: fc.constantFrom('PAUSE', 'RESUME', 'EXTEND', 'NEXT', 'SWELLING_INCREASED', 'TICK', 'BEGIN').map((type) => ({ type })) },
    { weight: 2, arbitrary: fc.constant({ type: 'SKIP', reason: 'athlete asked' }) },
    { weight: 1, arbitrary: fc.constantFrom(...redFlags.map((f) => f.id)).map((flag) => ({ type: 'RED_FLAG', flag })) },
    // Time passing, in whole seconds: up to 25 minutes at once (a sleeping tablet fires its timer late).
    { weight: 8, arbitrary: fc.integer({ min: 1, max: 1500 }).map((seconds) => ({ type: 'wait', seconds })) },
  );
  // Most runs begin first; some get events before BEGIN too.
  const eventStream = fc.tuple(fc.boolean(), fc.array(uiEvent, { maxLength: 40 })).map(([begin, events]) => (begin ? [{ type: 'BEGIN' }, ...events] : events));

  /** Cold applications from the log alone: [start, end, seconds on] per cold step that ran. */
  function coldFromLog(entries: LogEntry[]): { start: number; end: number; onMs: number; kind: StepKind }[] {
    const spans: { start: number; end: number; onMs: number; kind: StepKind }[] = [];
    let pausedMs = 0;
    let pausedAt: number | null = null;
    for (const entry of entries) {
      const at = Date.parse(entry.at);
      if (entry.type === 'paused') pausedAt = at;
      if (entry.type === 'resumed' && pausedAt !== null) {
        pausedMs += at - pausedAt;
        pausedAt = null;
      }
      if (entry.type === 'step-completed' || entry.type === 'step-skipped' || entry.type === 'step-interrupted') {
        const open = pausedAt === null ? 0 : at - pausedAt;
        const onMs = (entry.actualSeconds ?? 0) * 1000;
        if (entry.kind && cold(entry.kind) && onMs > 0) spans.push({ start: at - onMs - pausedMs - open, end: at, onMs, kind: entry.kind });
        pausedMs = 0;
        pausedAt = null;
      }
    }
    return spans;
  }

  it('every log the run can emit, for any order of events, keeps every rule', () => {
    fc.assert(
      fc.property(
        phase,
        fc.array(boundedStep, { minLength: 1, maxLength: 8 }),
        screening.map((answers) => ({ ...answers, redFlags: [] })),
        interval,
        eventStream,
        (p, steps, answers, seconds, events) => {
          const plan = planFrom(p, steps, answers, seconds);
          const clock = new SimulatedClock();
          clock.set(Date.parse('2025-03-30T09:00:00.000Z'));
          const actor = createActor(treatmentRunMachine, { input: { plan, now: clock.now() }, clock });
          const entries: LogEntry[] = [];
          actor.on('log', ({ entry }) => entries.push(entry));
          actor.start();
          let redFlagSent = false;
          for (const event of events) {
            if (actor.getSnapshot().status !== 'active') break;
            if (event.type === 'wait') clock.increment((event as { seconds: number }).seconds * 1000);
            else {
              if (event.type === 'RED_FLAG' && actor.getSnapshot().status === 'active') redFlagSent = true;
              actor.send({ ...event, at: clock.now() } as TreatmentRunEvent);
            }
          }

          for (const entry of entries) expect(logEntrySchema.safeParse(entry).error).toBeUndefined();
          const spans = coldFromLog(entries);
          spans.forEach((span, i) => {
            expect(span.onMs).toBeLessThanOrEqual(maxColdMs);
            if (span.kind === 'ice-massage') expect(span.onMs).toBeLessThanOrEqual(420 * 1000);
            if (i > 0) expect(span.start - spans[i - 1].end).toBeGreaterThanOrEqual(seconds * 1000);
          });
          const snapshot = actor.getSnapshot();
          const current = snapshot.status === 'active' ? snapshot.context.step : null;
          if (current && cold(current.kind) && snapshot.context.stepStartedAt !== null) {
            expect(current.seconds + snapshot.context.extendedSeconds).toBeLessThanOrEqual(1200);
            if (spans.length > 0) expect(snapshot.context.stepStartedAt - spans.at(-1)!.end).toBeGreaterThanOrEqual(seconds * 1000);
          }
          const logged = entries.flatMap((entry) => (entry.kind ? [entry.kind] : []));
          if (p === 'acute') expect(logged.filter(massage)).toEqual([]);
          if (answers.massageCautions.length > 0) expect(logged.filter(deep)).toEqual([]);
          if (answers.coldContraindications.length > 0) expect(logged.filter(cold)).toEqual([]);
          if (redFlagSent) {
            expect(snapshot.status).toBe('done');
            expect(snapshot.context.outcome).toBe('stopped-referred');
            expect(entries.at(-1)?.type).toBe('red-flag');
          }
        },
      ),
      { numRuns: 400 },
    );
  });
});
