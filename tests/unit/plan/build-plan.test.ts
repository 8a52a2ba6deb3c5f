import {
  buildPlan,
  cautionTexts,
  compressionCue,
  lightToleranceFactor,
  planSchema,
  type BuildPlanArgs,
  type Plan,
} from '../../../shared/plan/build-plan';
import { defaultSequences, sequenceSchema } from '../../../shared/plan/sequence';
import { stepKindInfo } from '../../../shared/plan/step-kinds';
import { phases, type Phase } from '../../../shared/phase';

function plan(phase: Phase, overrides: Partial<Omit<BuildPlanArgs, 'phase'>> = {}): Plan {
  return buildPlan({
    phase,
    sequence: defaultSequences[phase],
    tolerance: 'usual',
    coldContraindicated: false,
    suspectedMyositis: false,
    ...overrides,
  });
}

const kindsOf = (built: Plan) => built.steps.map((step) => step.kind);
const secondsOf = (built: Plan) => built.steps.map((step) => step.seconds);

describe('building a run plan', () => {
  it.each(phases)('the %s plan at usual tolerance keeps the sequence as it is', (phase) => {
    const built = plan(phase);
    expect(kindsOf(built)).toEqual(defaultSequences[phase].steps.map((step) => step.kind));
    expect(secondsOf(built)).toEqual(defaultSequences[phase].steps.map((step) => step.seconds));
    expect(built.steps.map((step) => step.index)).toEqual(built.steps.map((_, index) => index));
    expect(built.backToCold).toBe('cold-and-compression');
    expect(built.cautions).toEqual([]);
    expect(built.minColdIntervalSeconds).toBe(600);
  });

  it('each step carries its label, cue and flags for table mode', () => {
    const wrap = plan('acute').steps[1];
    expect(wrap).toMatchObject({
      index: 1,
      kind: 'compression-wrap',
      label: 'Compression wrap',
      needsConfirm: true,
      handsOn: true,
      optional: false,
    });
    expect(plan('proliferative').steps[5].optional).toBe(true);
  });

  it('light tolerance shortens hands-on work to three quarters and leaves the rest alone', () => {
    // 0.75 is a choice of ours (no published dose for a tender athlete).
    expect(lightToleranceFactor).toBe(0.75);
    const built = plan('remodelling', { tolerance: 'light' });
    // 300 s warm-up → 225 s; 180 s friction → 135 s; 120 s broadening and stripping → 90 s.
    expect(secondsOf(built).slice(0, 7)).toEqual([225, 135, 135, 90, 90, 90, 90]);
    expect(built.tolerance).toBe('light');
  });

  it('light tolerance never takes ice massage under its 5-minute minimum', () => {
    // 360 s × 0.75 = 270 s, below the 300 s minimum of ice massage 5–7 min (common practice): clipped to 300.
    const built = plan('proliferative', { tolerance: 'light' });
    expect(built.steps[0]).toMatchObject({ kind: 'ice-massage', seconds: 300 });
    // Active movement and the rest are not hands-on, so they keep their time.
    expect(built.steps[3]).toMatchObject({ kind: 'active-movement', seconds: 180 });
    expect(built.steps[4]).toMatchObject({ kind: 'rest-recheck', seconds: 120 });
  });

  it('light tolerance leaves the cold pack at its full time', () => {
    // 1200 s: cold 20 minutes out of every hour, common practice; the athlete does not tolerate it less by hand.
    expect(plan('acute', { tolerance: 'light' }).steps[0]).toMatchObject({ kind: 'cold-pack', seconds: 1200 });
  });

  it('light tolerance stops at the minimum of a short step', () => {
    const sequence = sequenceSchema.parse({ phase: 'remodelling', steps: [{ kind: 'warm-up-strokes', seconds: 70 }] });
    // 70 × 0.75 = 52.5 s, under the 60 s minimum of ours for warm-up strokes.
    expect(buildPlan({ phase: 'remodelling', sequence, tolerance: 'light', coldContraindicated: false, suspectedMyositis: false }).steps[0].seconds).toBe(
      stepKindInfo['warm-up-strokes'].bounds.min,
    );
  });

  it('a cold contraindication removes the cold pack and ice massage and makes swelling mean stop, elevate, refer', () => {
    // Cold contraindications: rehabilitation texts, common practice; the consequence is decisions.md's.
    const built = plan('proliferative', { coldContraindicated: true });
    expect(kindsOf(built)).toEqual(['light-strokes', 'passive-movement', 'active-movement', 'rest-recheck']);
    expect(built.steps.map((step) => step.index)).toEqual([0, 1, 2, 3]);
    expect(built.backToCold).toBe('stop-elevate-refer');
    expect(built.cautions).toEqual([cautionTexts.coldContraindicated, 'Left out of this plan: Ice massage (cold is contraindicated).']);
  });

  it('an acute plan without cold keeps the wrap and the re-check', () => {
    expect(kindsOf(plan('acute', { coldContraindicated: true }))).toEqual(['compression-wrap', 'rest-recheck']);
  });

  it('suspected myositis ossificans removes friction, broadening and stripping and says to refer for imaging', () => {
    // Deep work locally contraindicated, refer for imaging: Phys Sportsmed 1995;23(2):77–82 (authors and title not retrieved).
    const built = plan('remodelling', { suspectedMyositis: true });
    expect(kindsOf(built)).toEqual(['warm-up-strokes', 'ice-massage']);
    expect(built.cautions).toHaveLength(2);
    expect(built.cautions[0]).toMatch(/refer for imaging/i);
    expect(built.cautions[1]).toBe(
      'Left out of this plan: Cross-fibre friction, Multidirectional friction, Passive broadening, Active broadening, Passive stripping, Active stripping (deep work is not allowed after the screening).',
    );
  });

  it('both adjustments together leave only the warm-up in remodelling, with both cautions', () => {
    const built = plan('remodelling', { suspectedMyositis: true, coldContraindicated: true });
    expect(kindsOf(built)).toEqual(['warm-up-strokes']);
    expect(built.cautions.slice(0, 2)).toEqual([cautionTexts.coldContraindicated, cautionTexts.suspectedMyositis]);
  });

  it('a sequence of deep work only leaves an empty plan that says not to start', () => {
    const sequence = sequenceSchema.parse({ phase: 'remodelling', steps: [{ kind: 'cross-fibre-friction', seconds: 180 }] });
    const built = buildPlan({ phase: 'remodelling', sequence, tolerance: 'usual', coldContraindicated: false, suspectedMyositis: true });
    expect(built.steps).toEqual([]);
    expect(built.cautions).toContain(cautionTexts.nothingLeft);
  });

  it('the wrap cue names the pad size when it is known', () => {
    // Pad two to three times the size of the injury: common practice; the sizes here are an invented 5 × 3 cm bruise.
    const padSize = { minLengthCm: 10, maxLengthCm: 15, minWidthCm: 6, maxWidthCm: 9 };
    const wrap = plan('acute', { padSize }).steps[1];
    expect(wrap.cue).toBe('Felt pad 10–15 × 6–9 cm; figure-of-eight wrap, below to above');
    expect(plan('acute', { padSize }).padSize).toEqual(padSize);
  });

  it('the wrap cue falls back to the kind cue without a pad size', () => {
    expect(plan('acute').steps[1].cue).toBe(stepKindInfo['compression-wrap'].cue);
    expect(compressionCue(null)).toBe(stepKindInfo['compression-wrap'].cue);
  });

  it('pad sizes are shown in whole centimetres, and a single size once', () => {
    expect(compressionCue({ minLengthCm: 12.4, maxLengthCm: 12.4, minWidthCm: 7.6, maxWidthCm: 11.5 })).toBe(
      'Felt pad 12 × 8–12 cm; figure-of-eight wrap, below to above',
    );
  });

  it('every cue of every default plan stays one short line, pad size included', () => {
    // 64 characters: a table-mode layout choice of ours.
    const padSize = { minLengthCm: 18, maxLengthCm: 27, minWidthCm: 10, maxWidthCm: 15 };
    for (const phase of phases) {
      for (const step of plan(phase, { padSize }).steps) expect(step.cue.length, step.kind).toBeLessThanOrEqual(64);
    }
  });

  it('the acute re-check is also the home-care hand-off', () => {
    expect(plan('acute').steps[2].cue).toMatch(/home care/);
    expect(plan('proliferative').steps[4].cue).toBe(stepKindInfo['rest-recheck'].cue);
  });

  it('a sequence for another phase is refused', () => {
    expect(() =>
      buildPlan({ phase: 'acute', sequence: defaultSequences.remodelling, tolerance: 'usual', coldContraindicated: false, suspectedMyositis: false }),
    ).toThrow(/remodelling phase, not acute/);
  });

  it("the clinic's minimum cold interval is kept with the plan", () => {
    expect(plan('proliferative', { minColdIntervalSeconds: 900 }).minColdIntervalSeconds).toBe(900);
  });
});

describe('the plan schema', () => {
  it('accepts a plan as built and round-trips it through JSON', () => {
    const built = plan('proliferative', { padSize: { minLengthCm: 8, maxLengthCm: 12, minWidthCm: 4, maxWidthCm: 6 } });
    expect(planSchema.parse(JSON.parse(JSON.stringify(built)))).toEqual(built);
  });

  it('fills the defaults of a plan stored before the pad size and cold interval were kept', () => {
    const { padSize: _pad, minColdIntervalSeconds: _interval, ...older } = plan('acute');
    expect(planSchema.parse(older)).toMatchObject({ padSize: null, minColdIntervalSeconds: 600 });
  });

  it('refuses a stored plan whose ice massage breaks its bounds', () => {
    // 420 s max: ice massage 5–7 min, common practice.
    const built = plan('proliferative');
    const tampered = { ...built, steps: built.steps.map((step, i) => (i === 0 ? { ...step, seconds: 480 } : step)) };
    const result = planSchema.safeParse(tampered);
    expect(result.success).toBe(false);
    expect(result.error!.issues[0].path).toEqual(['steps', 0, 'seconds']);
  });

  it('refuses steps whose indexes skip', () => {
    const built = plan('acute');
    const tampered = { ...built, steps: built.steps.map((step, i) => (i === 2 ? { ...step, index: 5 } : step)) };
    expect(planSchema.safeParse(tampered).error!.issues[0].path).toEqual(['steps', 2, 'index']);
  });

  it('refuses a cold step in a plan that may not use cold', () => {
    const tampered = { ...plan('acute'), backToCold: 'stop-elevate-refer' };
    expect(planSchema.safeParse(tampered).error!.issues[0].path).toEqual(['steps', 0, 'kind']);
  });

  it('refuses a pad whose maximum is below its minimum', () => {
    const tampered = { ...plan('acute'), padSize: { minLengthCm: 10, maxLengthCm: 8, minWidthCm: 4, maxWidthCm: 6 } };
    expect(planSchema.safeParse(tampered).error!.issues[0].path).toEqual(['padSize', 'maxLengthCm']);
  });
});
