import { buildPlan, cautionTexts, planSchema } from '../../../shared/plan/build-plan';
import { defaultSequences, sequenceSchema } from '../../../shared/plan/sequence';
import { stepKinds, stepKindInfo } from '../../../shared/plan/step-kinds';
import { coldWaitMs, maxContinuousColdSeconds, stepRuleIssues } from '../../../shared/plan/treatment-rules';
import { screeningOutcome, screeningSchema } from '../../../shared/runs/screening';

const issuesOf = (input: unknown) => {
  const result = sequenceSchema.safeParse(input);
  return result.success ? [] : result.error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
};

describe('the treatment rules', () => {
  it('every cold kind is bounded within 20 minutes of continuous cold', () => {
    // No continuous cold over 20 minutes: common practice.
    expect(maxContinuousColdSeconds).toBe(1200);
    for (const kind of stepKinds.filter((k) => stepKindInfo[k].cold)) {
      expect(stepKindInfo[kind].bounds.max, kind).toBeLessThanOrEqual(1200);
    }
    // Ice massage 5–7 min at a time: common practice.
    expect(stepKindInfo['ice-massage'].bounds).toEqual({ min: 300, max: 420 });
  });

  describe('a sequence', () => {
    it('refuses a cold pack 30 seconds after a 7-minute ice massage', () => {
      const issues = issuesOf({
        phase: 'proliferative',
        steps: [
          { kind: 'ice-massage', seconds: 420 },
          { kind: 'rest-recheck', seconds: 30 },
          { kind: 'cold-pack', seconds: 1200 },
        ],
      });
      expect(issues).toEqual([{ path: 'steps.2.kind', message: expect.stringMatching(/Cold pack would start 0.5 min after the previous cold step ended/) }]);
    });

    it('refuses two cold packs back to back', () => {
      const issues = issuesOf({ phase: 'acute', steps: [{ kind: 'cold-pack', seconds: 600 }, { kind: 'cold-pack', seconds: 600 }] });
      expect(issues).toEqual([{ path: 'steps.1.kind', message: expect.stringMatching(/straight after the previous cold step/) }]);
    });

    it('refuses ice massages 30 seconds apart', () => {
      const issues = issuesOf({
        phase: 'proliferative',
        steps: [
          { kind: 'ice-massage', seconds: 300 },
          { kind: 'rest-recheck', seconds: 30 },
          { kind: 'ice-massage', seconds: 300 },
        ],
      });
      expect(issues.map((issue) => issue.path)).toEqual(['steps.2.kind']);
    });

    it("checks the clinic's own minimum interval, not only the shortest one a clinic may set", () => {
      const steps = [
        { kind: 'ice-massage' as const, seconds: 360 },
        { kind: 'light-strokes' as const, seconds: 600 },
        { kind: 'ice-massage' as const, seconds: 360 },
      ];
      expect(stepRuleIssues('proliferative', steps, 600)).toEqual([]);
      expect(stepRuleIssues('proliferative', steps, 900).map((issue) => [issue.index, issue.field])).toEqual([[2, 'kind']]);
    });

    it('the default sequences keep the rules at the default 10-minute interval', () => {
      for (const sequence of Object.values(defaultSequences)) expect(stepRuleIssues(sequence.phase, sequence.steps, 600)).toEqual([]);
    });
  });

  describe('a plan', () => {
    it('a stored plan that breaks a rule is refused, so the run never plays it', () => {
      const step = (index: number, kind: 'cold-pack' | 'ice-massage', seconds: number) => ({
        index, kind, label: stepKindInfo[kind].label, seconds, cue: 'x', needsConfirm: false, handsOn: false, optional: false,
      });
      const result = planSchema.safeParse({
        phase: 'proliferative', tolerance: 'usual', cautions: [], backToCold: 'cold-and-compression',
        steps: [step(0, 'cold-pack', 1200), step(1, 'ice-massage', 300)],
      });
      expect(result.success).toBe(false);
    });

    it.each([
      ['anticoagulants-or-bleeding-disorder', cautionTexts.bleedingRisk],
      ['open-skin', cautionTexts.openSkin],
    ] as const)('%s at screening removes friction, broadening and stripping, and the plan says so', (caution, text) => {
      // Massage cautions: anticoagulants or bleeding disorders, open skin (clinical notes: common practice).
      const outcome = screeningOutcome(screeningSchema.parse({ massageCautions: [caution], tolerance: 'usual', cautionsAcknowledged: true }));
      const plan = buildPlan({
        phase: 'remodelling',
        sequence: defaultSequences.remodelling,
        tolerance: 'usual',
        coldContraindicated: outcome.coldContraindicated,
        suspectedMyositis: outcome.suspectedMyositis,
        bleedingRisk: outcome.bleedingRisk,
        openSkin: outcome.openSkin,
      });
      expect(plan.steps.map((s) => s.kind)).toEqual(['warm-up-strokes', 'ice-massage']);
      expect(plan.cautions[0]).toBe(text);
      expect(plan.cautions).toContain(
        'Left out of this plan: Cross-fibre friction, Multidirectional friction, Passive broadening, Active broadening, Passive stripping, Active stripping (deep work is not allowed after the screening).',
      );
    });

    it('a cold step brought too close by the clinic interval is left out, and the plan says why', () => {
      // The default proliferative sequence has 13 min between its ice massages; a clinic interval of 15 min.
      const plan = buildPlan({ phase: 'proliferative', sequence: defaultSequences.proliferative, tolerance: 'usual', coldContraindicated: false, suspectedMyositis: false, minColdIntervalSeconds: 900 });
      expect(plan.steps.map((s) => s.kind)).toEqual(['ice-massage', 'light-strokes', 'passive-movement', 'active-movement', 'rest-recheck']);
      expect(plan.cautions).toEqual([
        "Left out of this plan: Ice massage would start 13 min after the previous cold step ended; cold needs a break of at least 15 min (the clinic's minimum interval).",
      ]);
    });

    it('a plan for light tolerance says its hands-on steps are shortened', () => {
      const plan = buildPlan({ phase: 'remodelling', sequence: defaultSequences.remodelling, tolerance: 'light', coldContraindicated: false, suspectedMyositis: false });
      expect(plan.cautions).toContain(cautionTexts.lightTolerance);
    });
  });

  describe('the wait before cold in a run', () => {
    it('counts from when the last cold step came off, or is the whole interval when cold is on now', () => {
      expect(coldWaitMs({ now: 1000, lastColdEndedAt: null, currentIsCold: false, minColdIntervalSeconds: 600 })).toBe(0);
      expect(coldWaitMs({ now: 30_000, lastColdEndedAt: 0, currentIsCold: false, minColdIntervalSeconds: 600 })).toBe(570_000);
      expect(coldWaitMs({ now: 700_000, lastColdEndedAt: 0, currentIsCold: false, minColdIntervalSeconds: 600 })).toBe(0);
      expect(coldWaitMs({ now: 5, lastColdEndedAt: null, currentIsCold: true, minColdIntervalSeconds: 600 })).toBe(600_000);
    });
  });
});
