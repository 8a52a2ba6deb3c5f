import { buildPlan } from '../../../shared/plan/build-plan';
import { defaultSequences } from '../../../shared/plan/sequence';
import { buildTimeline, type TimelineEntry } from '../../../shared/review/timeline';

const plan = buildPlan({ phase: 'proliferative', sequence: defaultSequences.proliferative, tolerance: 'usual', coldContraindicated: false, suspectedMyositis: false });
const start = Date.parse('2026-03-12T10:00:00.000Z');
const at = (minutes: number) => new Date(start + minutes * 60_000).toISOString();
const e = (over: Partial<TimelineEntry> & Pick<TimelineEntry, 'seq' | 'type' | 'at'>): TimelineEntry => ({
  stepIndex: null,
  kind: null,
  plannedSeconds: null,
  actualSeconds: null,
  reason: null,
  detail: null,
  ...over,
});

describe('a run timeline, planned against actual', () => {
  it('shows completed, skipped, interrupted, back-to-cold and not-reached steps in the order they happened', () => {
    const entries: TimelineEntry[] = [
      // Arrived out of order, as an outbox can send them: the machine's count puts them back.
      e({ seq: 2, type: 'step-skipped', stepIndex: 1, kind: 'light-strokes', plannedSeconds: 300, actualSeconds: 20, at: at(7), reason: 'athlete guarding', detail: 'required step' }),
      e({ seq: 1, type: 'step-completed', stepIndex: 0, kind: 'ice-massage', plannedSeconds: 360, actualSeconds: 360, at: at(6) }),
      e({ seq: 3, type: 'paused', stepIndex: 2, kind: 'passive-movement', at: at(8) }),
      e({ seq: 4, type: 'step-interrupted', stepIndex: 2, kind: 'passive-movement', plannedSeconds: 180, actualSeconds: 60, at: at(9), reason: 'swelling increased' }),
      e({ seq: 5, type: 'swelling-check', stepIndex: 2, kind: 'passive-movement', at: at(9), detail: 'increased' }),
      e({ seq: 6, type: 'step-completed', kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200, at: at(29), detail: 'back to cold' }),
      e({ seq: 7, type: 'step-completed', kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 150, at: at(32), detail: 'back to cold' }),
      e({ seq: 8, type: 'run-fell-back', at: at(32), reason: 'swelling increased' }),
    ];
    const rows = buildTimeline(plan, entries);
    expect(rows.map((r) => [r.stepIndex, r.kind, r.stage, r.result])).toEqual([
      [0, 'ice-massage', 'plan', 'completed'],
      [1, 'light-strokes', 'plan', 'skipped'],
      [2, 'passive-movement', 'plan', 'interrupted'],
      [null, 'cold-pack', 'back-to-cold', 'completed'],
      [null, 'compression-wrap', 'back-to-cold', 'completed'],
      [3, 'active-movement', 'plan', 'not-reached'],
      [4, 'rest-recheck', 'plan', 'not-reached'],
      [5, 'ice-massage', 'plan', 'not-reached'],
    ]);
    expect(rows[1]).toMatchObject({ reason: 'athlete guarding', plannedSeconds: 300, actualSeconds: 20 });
    expect(rows[3]).toMatchObject({ label: 'Back to cold: cold pack', plannedSeconds: 1200 });
    expect(rows[5]).toMatchObject({ actualSeconds: null, startedAt: null, reason: null });
  });

  it('starts the first step its run time before it ended, and each later step when the one before ended', () => {
    const rows = buildTimeline(plan, [
      e({ seq: 1, type: 'step-completed', stepIndex: 0, kind: 'ice-massage', plannedSeconds: 360, actualSeconds: 360, at: at(6) }),
      e({ seq: 2, type: 'step-completed', stepIndex: 1, kind: 'light-strokes', plannedSeconds: 300, actualSeconds: 300, at: at(12) }),
    ]);
    expect(rows[0].startedAt).toBe(at(0));
    // A minute's pause inside step 2 is wall-clock time: it started when step 1 ended.
    expect(rows[1].startedAt).toBe(at(6));
  });

  it('takes the planned seconds from the plan, not from an extension', () => {
    const rows = buildTimeline(plan, [
      e({ seq: 1, type: 'extended', stepIndex: 0, kind: 'ice-massage', plannedSeconds: 420, at: at(5), detail: 'added 60 s' }),
      e({ seq: 2, type: 'step-completed', stepIndex: 0, kind: 'ice-massage', plannedSeconds: 360, actualSeconds: 420, at: at(7) }),
    ]);
    expect(rows[0]).toMatchObject({ plannedSeconds: 360, actualSeconds: 420, result: 'completed' });
  });
});
