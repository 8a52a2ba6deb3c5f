import { injuryCreateSchema, injuryUpdateSchema, phaseOverrideBodySchema, phaseOverrideSchema } from '../../../shared/records/injury';
import { issuesOf } from '../../support/zod-issues';

beforeEach(() => {
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(new Date('2025-06-12T12:00:00Z'));
});
afterEach(() => {
  vi.useRealTimers();
});

const valid = {
  athleteId: '2f1c6b1e-8d3a-4f7e-9a51-0c2d7e4b9a13',
  region: 'anterior-thigh',
  side: 'left',
  mechanismKind: 'knee-to-thigh',
  mechanism: 'Knee to the thigh in a tackle',
  injuredAt: '2025-06-11T19:30:00+01:00',
};

describe('injuryCreateSchema', () => {
  it('accepts an injury and fills the defaults', () => {
    const injury = injuryCreateSchema.parse(valid);
    expect(injury.haematomaType).toBe('not-known');
    expect(injury.previousQuadricepsInjury).toBe(false);
    expect(injury.kneeEffusion).toBe(false);
  });

  it('rejects a region that is not on the body map', () => {
    const issues = issuesOf(injuryCreateSchema.safeParse({ ...valid, region: 'thigh' }));
    expect(issues[0].path).toBe('region');
    expect(issues[0].message).toMatch(/anterior-thigh/);
  });

  it('rejects an unknown side, mechanism kind and haematoma type with their paths', () => {
    const issues = issuesOf(
      injuryCreateSchema.safeParse({ ...valid, side: 'both', mechanismKind: 'kick', haematomaType: 'deep' }),
    );
    expect(issues.map((i) => i.path)).toEqual(['side', 'mechanismKind', 'haematomaType']);
  });

  it('rejects a mechanism over 500 characters', () => {
    expect(issuesOf(injuryCreateSchema.safeParse({ ...valid, mechanism: 'x'.repeat(501) }))).toEqual([
      { path: 'mechanism', message: 'Mechanism must be at most 500 characters' },
    ]);
  });

  it('rejects an athlete id that is not a UUID', () => {
    expect(issuesOf(injuryCreateSchema.safeParse({ ...valid, athleteId: '42' }))[0].path).toBe('athleteId');
  });

  it('allows an injury time up to 5 minutes ahead of the clock, and no more', () => {
    // 5 minutes of clock skew: a choice of ours
    expect(injuryCreateSchema.safeParse({ ...valid, injuredAt: '2025-06-12T12:05:00Z' }).success).toBe(true);
    expect(issuesOf(injuryCreateSchema.safeParse({ ...valid, injuredAt: '2025-06-12T12:05:01Z' }))).toEqual([
      { path: 'injuredAt', message: 'Injury date and time cannot be in the future' },
    ]);
  });

  it('rejects a treatment start before the injury, pointing at the treatment start', () => {
    expect(issuesOf(injuryCreateSchema.safeParse({ ...valid, treatmentStartedAt: '2025-06-11T18:00:00Z' }))).toEqual([
      { path: 'treatmentStartedAt', message: 'Treatment start cannot be before the injury' },
    ]);
    expect(injuryCreateSchema.safeParse({ ...valid, treatmentStartedAt: '2025-06-11T18:31:00Z' }).success).toBe(true);
  });
});

describe('injuryUpdateSchema', () => {
  it('accepts closing an injury and leaves omitted fields out', () => {
    expect(injuryUpdateSchema.parse({ status: 'closed', closedAt: '2025-06-12T10:00:00Z' })).toEqual({
      status: 'closed',
      closedAt: '2025-06-12T10:00:00Z',
    });
  });

  it('rejects a closed date on an open injury', () => {
    expect(issuesOf(injuryUpdateSchema.safeParse({ status: 'open', closedAt: '2025-06-12T10:00:00Z' }))).toEqual([
      { path: 'closedAt', message: 'An open injury cannot have a closed date' },
    ]);
  });

  it('does not let the athlete of an injury change', () => {
    expect(injuryUpdateSchema.parse({ athleteId: valid.athleteId, side: 'right' })).toEqual({ side: 'right' });
  });
});

describe('phaseOverrideSchema', () => {
  it('needs a reason of at least 5 characters', () => {
    expect(phaseOverrideSchema.safeParse({ phase: 'acute', reason: 'Still guarding' }).success).toBe(true);
    expect(issuesOf(phaseOverrideSchema.safeParse({ phase: 'acute', reason: ' ok ' }))).toEqual([
      { path: 'reason', message: 'Override reason must be between 5 and 500 characters' },
    ]);
  });

  it('accepts only the three phases', () => {
    expect(issuesOf(phaseOverrideSchema.safeParse({ phase: 'chronic', reason: 'Long standing' }))[0].path).toBe('phase');
  });

  it('accepts null in the endpoint body to clear an override', () => {
    expect(phaseOverrideBodySchema.parse({ override: null })).toEqual({ override: null });
  });
});
