import { assessMyositisRisk, isFootballCode, isTreatmentDelayed, type MyositisRiskInput } from '../../../shared/clinical/myositis-risk';

// Risk factors: Ryan JB et al., Am J Sports Med 1991;19(3):299–304 — knee flexion < 120°, injury in
// football, previous quadriceps injury, treatment delayed > 3 days, knee effusion.
const injuredAt = '2025-05-10T15:00:00Z';
const base: MyositisRiskInput = {
  region: 'anterior-thigh',
  kneeFlexionDegs: [130],
  previousQuadricepsInjury: false,
  kneeEffusion: false,
  sport: 'Hockey',
  injuredAt,
  treatmentStartedAt: '2025-05-10T16:00:00Z',
  now: '2025-05-11T15:00:00Z',
};

function factorIds(input: Partial<MyositisRiskInput>) {
  return assessMyositisRisk({ ...base, ...input }).factors.map((f) => f.id);
}

describe('assessMyositisRisk', () => {
  it('raises no factor and no caution when none of the published factors is present', () => {
    const result = assessMyositisRisk(base);
    expect(result.applies).toBe(true);
    expect(result.factors).toEqual([]);
    expect(result.caution).toBeNull();
  });

  it('flags knee flexion of 119° but not 120°', () => {
    expect(factorIds({ kneeFlexionDegs: [119] })).toContain('knee-flexion-below-120'); // Ryan et al. 1991: < 120°
    expect(factorIds({ kneeFlexionDegs: [120] })).not.toContain('knee-flexion-below-120'); // Ryan et al. 1991: < 120°
  });

  it('counts the lowest flexion recorded, even after range has recovered', () => {
    expect(factorIds({ kneeFlexionDegs: [80, 135] })).toContain('knee-flexion-below-120'); // Ryan et al. 1991: < 120°
  });

  it('flags a previous quadriceps injury and a knee effusion', () => {
    const ids = factorIds({ previousQuadricepsInjury: true, kneeEffusion: true });
    expect(ids).toEqual(['previous-quadriceps-injury', 'knee-effusion']); // Ryan et al. 1991 factors
  });

  it('flags treatment that began more than 3 days after injury, but not at exactly 3 days', () => {
    // Ryan et al. 1991: treatment delayed > 3 days
    expect(isTreatmentDelayed(injuredAt, '2025-05-13T15:00:00Z', '2025-05-20T00:00:00Z')).toBe(false);
    expect(isTreatmentDelayed(injuredAt, '2025-05-13T15:01:00Z', '2025-05-20T00:00:00Z')).toBe(true);
  });

  it('treats an unrecorded treatment start as delayed once more than 3 days have passed', () => {
    // Ryan et al. 1991: treatment delayed > 3 days; reading of a missing start is Mendstep's choice
    expect(isTreatmentDelayed(injuredAt, null, '2025-05-13T14:59:00Z')).toBe(false);
    expect(isTreatmentDelayed(injuredAt, null, '2025-05-13T15:01:00Z')).toBe(true);
  });

  it('recognises football codes in the sport text and not other sports', () => {
    // Ryan et al. 1991: "injury in football" (West Point cadets); widening to all football codes is Mendstep's reading
    expect(isFootballCode('American football')).toBe(true);
    expect(isFootballCode('Football (soccer)')).toBe(true);
    expect(isFootballCode('soccer')).toBe(true);
    expect(isFootballCode('Rugby union')).toBe(true);
    expect(isFootballCode('Gaelic football')).toBe(true);
    expect(isFootballCode('Field hockey')).toBe(false);
    expect(isFootballCode('Netball')).toBe(false);
    expect(isFootballCode(undefined)).toBe(false);
  });

  it('adds the football factor from the athlete sport', () => {
    expect(factorIds({ sport: 'Soccer' })).toContain('football'); // Ryan et al. 1991: injury in football
  });

  it('gives the caution with its journal reference when any factor is present', () => {
    const result = assessMyositisRisk({ ...base, kneeEffusion: true });
    expect(result.caution?.lines.join(' ')).toMatch(/Avoid deep work over the site/);
    expect(result.caution?.lines.join(' ')).toMatch(/refer for imaging/);
    expect(result.caution?.source).toContain('Phys Sportsmed 1995;23(2):77–82'); // journal reference, title not retrieved
  });

  it('applies to lateral and posterior thigh but not to the medial thigh or calf', () => {
    // decisions.md: "thigh" = anterior, lateral or posterior thigh regions
    expect(assessMyositisRisk({ ...base, region: 'lateral-thigh', kneeEffusion: true }).applies).toBe(true);
    expect(assessMyositisRisk({ ...base, region: 'posterior-thigh', kneeEffusion: true }).factors).toHaveLength(1);
    const medial = assessMyositisRisk({ ...base, region: 'medial-thigh', kneeEffusion: true });
    expect(medial.applies).toBe(false);
    expect(medial.caution).toBeNull();
    expect(assessMyositisRisk({ ...base, region: 'calf', kneeEffusion: true }).factors).toEqual([]);
  });
});
