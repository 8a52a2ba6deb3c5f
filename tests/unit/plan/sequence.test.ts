import { defaultSequences, maxSequenceSteps, sequenceSchema } from '../../../shared/plan/sequence';
import { phases } from '../../../shared/phase';

function issuesOf(input: unknown) {
  const result = sequenceSchema.safeParse(input);
  expect(result.success).toBe(false);
  return result.error!.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
}

describe('the sequence schema', () => {
  it.each(phases)('the default %s sequence is valid', (phase) => {
    const result = sequenceSchema.safeParse(defaultSequences[phase]);
    expect(result.success).toBe(true);
    expect(defaultSequences[phase].phase).toBe(phase);
  });

  it('the default acute sequence is a 20-minute cold pack, the wrap, then the home-care re-check', () => {
    // 1200 s cold pack: cold 20 minutes out of every hour, common practice.
    expect(defaultSequences.acute.steps.map(({ kind, seconds }) => [kind, seconds])).toEqual([
      ['cold-pack', 1200],
      ['compression-wrap', 180],
      ['rest-recheck', 300],
    ]);
  });

  it('the default proliferative sequence opens with a 6-minute ice massage and ends with an optional one', () => {
    // 360 s sits inside ice massage 5–7 min: common practice.
    const steps = defaultSequences.proliferative.steps;
    expect(steps.map((step) => step.kind)).toEqual([
      'ice-massage',
      'light-strokes',
      'passive-movement',
      'active-movement',
      'rest-recheck',
      'ice-massage',
    ]);
    expect(steps[0]).toEqual({ kind: 'ice-massage', seconds: 360, optional: false });
    expect(steps[5]).toEqual({ kind: 'ice-massage', seconds: 360, optional: true });
  });

  it('the default remodelling sequence works from warm-up to stripping and ends with an optional ice massage', () => {
    const steps = defaultSequences.remodelling.steps;
    expect(steps.map((step) => step.kind)).toEqual([
      'warm-up-strokes',
      'cross-fibre-friction',
      'multidirectional-friction',
      'passive-broadening',
      'active-broadening',
      'passive-stripping',
      'active-stripping',
      'ice-massage',
    ]);
    expect(steps.filter((step) => step.optional).map((step) => step.kind)).toEqual(['ice-massage']);
  });

  it('an ice massage over 7 minutes is refused with the field path and the allowed range', () => {
    // 420 s max: ice massage 5–7 min, common practice.
    const issues = issuesOf({
      phase: 'proliferative',
      steps: [
        { kind: 'light-strokes', seconds: 120 },
        { kind: 'ice-massage', seconds: 421 },
      ],
    });
    expect(issues).toEqual([
      { path: 'steps.1.seconds', message: 'Ice massage must last between 300 and 420 seconds (5–7 min)' },
    ]);
  });

  it('an ice massage under 5 minutes is refused', () => {
    // 300 s min: ice massage 5–7 min, common practice.
    expect(issuesOf({ phase: 'proliferative', steps: [{ kind: 'ice-massage', seconds: 299 }] })[0].path).toBe(
      'steps.0.seconds',
    );
  });

  it('a cold pack over 20 minutes is refused', () => {
    // 1200 s max: no continuous cold over 20 min, common practice.
    const issues = issuesOf({ phase: 'acute', steps: [{ kind: 'cold-pack', seconds: 1260 }] });
    expect(issues).toEqual([
      { path: 'steps.0.seconds', message: 'Cold pack must last between 300 and 1200 seconds (5–20 min)' },
    ]);
  });

  it('a step of a fraction of a second is refused', () => {
    expect(issuesOf({ phase: 'remodelling', steps: [{ kind: 'warm-up-strokes', seconds: 90.5 }] })[0]).toEqual({
      path: 'steps.0.seconds',
      message: 'Seconds must be a whole number',
    });
  });

  it('an acute sequence cannot hold massage', () => {
    // No massage for 24–72 h after the injury: common practice.
    const issues = issuesOf({
      phase: 'acute',
      steps: [
        { kind: 'cold-pack', seconds: 1200 },
        { kind: 'light-strokes', seconds: 120 },
        { kind: 'cross-fibre-friction', seconds: 120 },
      ],
    });
    expect(issues.map((issue) => issue.path)).toEqual(['steps.1.kind', 'steps.2.kind']);
    expect(issues[0].message).toMatch(/Light centre-out strokes.*acute/);
  });

  it('the same strokes are accepted in the proliferative phase', () => {
    const result = sequenceSchema.safeParse({ phase: 'proliferative', steps: [{ kind: 'light-strokes', seconds: 120 }] });
    expect(result.success).toBe(true);
  });

  it('an empty sequence is refused', () => {
    expect(issuesOf({ phase: 'remodelling', steps: [] })).toEqual([
      { path: 'steps', message: 'A sequence needs at least one step' },
    ]);
  });

  it('a sequence may hold 20 steps but not 21', () => {
    const steps = (count: number) => Array.from({ length: count }, () => ({ kind: 'rest-recheck', seconds: 60 }));
    expect(maxSequenceSteps).toBe(20);
    expect(sequenceSchema.safeParse({ phase: 'remodelling', steps: steps(20) }).success).toBe(true);
    expect(issuesOf({ phase: 'remodelling', steps: steps(21) })[0].path).toBe('steps');
  });

  it('a step is required unless marked optional', () => {
    const parsed = sequenceSchema.parse({ phase: 'remodelling', steps: [{ kind: 'warm-up-strokes', seconds: 300 }] });
    expect(parsed.steps[0].optional).toBe(false);
  });

  it('an unknown step kind is refused at its path', () => {
    expect(issuesOf({ phase: 'remodelling', steps: [{ kind: 'hot-stones', seconds: 300 }] })[0].path).toBe(
      'steps.0.kind',
    );
  });
});
