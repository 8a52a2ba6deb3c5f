import { DateTime } from 'luxon';
import { assessInjury, type AssessInjuryInput, type MeasurementForAssessment } from '../../../shared/clinical/assess-injury';
import { defaultClinicSettings } from '../../../shared/clinic/settings';

const injuredAt = '2025-09-06T15:00:00Z';
const hoursAfter = (hours: number) => DateTime.fromISO(injuredAt, { zone: 'utc' }).plus({ hours }).toISO()!;
const site = { girthLandmark: 'Superior pole of patella', girthDistanceCm: 20 };

const first: MeasurementForAssessment = {
  takenAt: hoursAfter(18),
  kneeFlexionDeg: 70,
  girthInjuredCm: 52,
  girthOtherCm: 50,
  ...site,
  painNprs: 7,
  bruiseLengthCm: 6,
  bruiseWidthCm: 4,
};
const second: MeasurementForAssessment = {
  takenAt: hoursAfter(40),
  kneeFlexionDeg: 100,
  girthInjuredCm: 52.5,
  girthOtherCm: 50,
  ...site,
  painNprs: 5,
  bruiseLengthCm: 8,
  bruiseWidthCm: 5,
};

function assess(overrides: Partial<AssessInjuryInput> = {}) {
  return assessInjury({
    injury: { region: 'anterior-thigh', injuredAt, previousQuadricepsInjury: false, kneeEffusion: false },
    athleteSport: 'American football',
    measurements: [second, first], // deliberately out of order
    settings: defaultClinicSettings,
    now: hoursAfter(60),
    ...overrides,
  });
}

describe('assessInjury', () => {
  it('grades from the latest knee-flexion reading and gives the published mean time lost', () => {
    const result = assess();
    expect(result.severity?.grade).toBe('mild'); // Ryan et al. 1991, Am J Sports Med 19(3): 100° > 90° is mild
    expect(result.severity?.timingWarning).toBeUndefined(); // measured at 40 h, inside 12–48 h (Ryan 1991; Jackson & Feagin 1973)
    expect(result.timeLost?.meanDays).toBe(13); // Ryan et al. 1991: mean disability for mild, 13 days
  });

  it('suggests proliferative for a mild contusion after 48 hours without increased swelling', () => {
    const result = assess();
    expect(result.daysSinceInjury).toBe(2); // 60 h since injury
    expect(result.girth.changeDifferenceCm).toBe(0.5);
    expect(result.girth.swellingIncreased).toBe(false); // 0.5 cm ≤ 1.0 cm clinic default (ours, not published)
    expect(result.suggestedPhase).toBe('proliferative'); // common practice: mild may leave acute after 48 h
    expect(result.phase).toBe('proliferative');
    expect(result.phaseIsOverride).toBe(false);
  });

  it('raises the myositis risk factors present, with the caution', () => {
    const result = assess();
    // Ryan et al. 1991 factors: lowest flexion 70° < 120°, and injury in football
    expect(result.risks.factors.map((f) => f.id)).toEqual(['knee-flexion-below-120', 'football']);
    expect(result.risks.caution?.source).toContain('Phys Sportsmed 1995;23(2):77–82');
  });

  it('uses the first measurement as the treatment start when none is recorded', () => {
    const late = { ...first, takenAt: hoursAfter(80) };
    const result = assess({ measurements: [late, { ...second, takenAt: hoursAfter(90) }], now: hoursAfter(100) });
    // Ryan et al. 1991: treatment delayed > 3 days (72 h); first contact at 80 h
    expect(result.risks.factors.map((f) => f.id)).toContain('treatment-delayed');
  });

  it('prefers the recorded treatment start over the first measurement', () => {
    const late = { ...first, takenAt: hoursAfter(80) };
    const result = assess({
      injury: { region: 'anterior-thigh', injuredAt, previousQuadricepsInjury: false, kneeEffusion: false, treatmentStartedAt: hoursAfter(2) },
      measurements: [late],
      now: hoursAfter(100),
    });
    expect(result.risks.factors.map((f) => f.id)).not.toContain('treatment-delayed'); // Ryan et al. 1991: > 3 days
  });

  it('gives the latest pain change and pad size', () => {
    const result = assess();
    expect(result.pain).toMatchObject({ previous: 7, latest: 5, clinicallyImportant: true }); // Farrar et al. 2001: ≥ 2 points
    expect(result.padSize?.length).toEqual({ minCm: 16, maxCm: 24 }); // common practice: 2–3 × the 8 cm bruise
  });

  it('returns to acute when swelling increased since the last measurement', () => {
    const swollen = { ...second, girthInjuredCm: 53.5 }; // difference 2 → 3.5 cm, a 1.5 cm rise
    const result = assess({ measurements: [first, swollen] });
    expect(result.girth.swellingIncreased).toBe(true); // > 1.0 cm clinic default (ours, not published)
    expect(result.suggestedPhase).toBe('acute'); // common practice: swelling increased → back to cold and compression
  });

  it('lets the therapist override win and says so', () => {
    const result = assess({
      injury: {
        region: 'anterior-thigh',
        injuredAt,
        previousQuadricepsInjury: false,
        kneeEffusion: false,
        phaseOverride: { phase: 'acute', reason: 'Athlete still guarding the knee' },
      },
    });
    expect(result.suggestedPhase).toBe('proliferative'); // common practice: mild after 48 h
    expect(result.phase).toBe('acute');
    expect(result.phaseIsOverride).toBe(true);
    expect(result.phaseReason).toMatch(/by the therapist: Athlete still guarding the knee/);
  });

  it('warns about timing when the only flexion reading was taken before 12 hours', () => {
    const early = { takenAt: hoursAfter(6), kneeFlexionDeg: 40 };
    const result = assess({ measurements: [early], now: hoursAfter(8) });
    expect(result.severity?.grade).toBe('severe'); // Ryan et al. 1991: < 45°
    expect(result.severity?.timingWarning).toMatch(/6 h after injury/); // outside 12–48 h (Ryan 1991; Jackson & Feagin 1973)
  });

  it('does not grade or give time lost for a calf contusion, and raises no thigh risks', () => {
    const result = assess({
      injury: { region: 'calf', injuredAt, previousQuadricepsInjury: false, kneeEffusion: true },
      now: hoursAfter(8 * 24),
    });
    expect(result.severity).toBeNull(); // decisions.md: knee-flexion grading is for the anterior thigh only
    expect(result.timeLost).toBeNull();
    expect(result.risks.applies).toBe(false); // Ryan et al. 1991 factors are for the thigh (decisions.md regions)
    expect(result.suggestedPhase).toBe('proliferative'); // Kannus 2000: day 8 is in the 7–21 band
  });

  it('works with Date objects as the database returns them', () => {
    const result = assess({
      injury: { region: 'anterior-thigh', injuredAt: new Date(injuredAt), previousQuadricepsInjury: false, kneeEffusion: false },
      measurements: [{ ...first, takenAt: new Date(hoursAfter(18)) }],
      now: new Date(hoursAfter(25 * 24)),
    });
    expect(result.daysSinceInjury).toBe(25);
    expect(result.phase).toBe('remodelling'); // Kannus 2000: beyond day 21
  });
});
