import {
  logEntrySchema,
  logEntryTypes,
  runOutcomes,
  runStatuses,
  statusForOutcome,
} from '../../../shared/runs/log-entry';

const at = '2025-03-30T09:06:00.000Z';

describe('the log entry schema', () => {
  it('holds every type the API contract names', () => {
    expect(logEntryTypes).toEqual(
      expect.arrayContaining([
        'step-completed',
        'step-skipped',
        'step-interrupted',
        'swelling-check',
        'paused',
        'resumed',
        'red-flag',
        'run-completed',
        'run-fell-back',
      ]),
    );
  });

  it('accepts a completed step', () => {
    const entry = { type: 'step-completed', stepIndex: 0, kind: 'ice-massage', plannedSeconds: 360, actualSeconds: 360, at };
    expect(logEntrySchema.parse(entry)).toEqual(entry);
  });

  it('a step entry must name the kind of step', () => {
    const result = logEntrySchema.safeParse({ type: 'step-interrupted', stepIndex: 1, at, reason: 'swelling increased' });
    expect(result.error!.issues.map((issue) => issue.path)).toEqual([['kind']]);
  });

  it.each(['step-skipped', 'red-flag', 'run-ended-early'])('a %s entry needs a reason', (type) => {
    const result = logEntrySchema.safeParse({ type, kind: 'light-strokes', at });
    expect(result.error!.issues.map((issue) => issue.path)).toEqual([['reason']]);
  });

  it('a blank reason is no reason', () => {
    expect(logEntrySchema.safeParse({ type: 'run-ended-early', at, reason: '   ' }).success).toBe(false);
  });

  it('the time must be an ISO instant with its offset', () => {
    expect(logEntrySchema.safeParse({ type: 'run-completed', at: '2025-03-30 09:06' }).error!.issues[0].path).toEqual(['at']);
    expect(logEntrySchema.safeParse({ type: 'run-completed', at: '2025-03-30T11:06:00+02:00' }).success).toBe(true);
  });

  it('refuses an unknown type, a negative time and a fraction of a second', () => {
    expect(logEntrySchema.safeParse({ type: 'step-started', at }).success).toBe(false);
    expect(logEntrySchema.safeParse({ type: 'step-completed', kind: 'cold-pack', actualSeconds: -1, at }).success).toBe(false);
    expect(logEntrySchema.safeParse({ type: 'step-completed', kind: 'cold-pack', actualSeconds: 1.5, at }).success).toBe(false);
  });
});

describe('run statuses and outcomes', () => {
  it('lists the statuses a run can have', () => {
    expect(runStatuses).toEqual(['screening', 'ready', 'running', 'completed', 'fell-back', 'stopped-referred', 'ended-early', 'abandoned']);
  });

  it('files stop, elevate, refer with the fall backs and every other outcome under its own name', () => {
    expect(runOutcomes.map(statusForOutcome)).toEqual(['completed', 'fell-back', 'fell-back', 'stopped-referred', 'ended-early']);
  });
});
