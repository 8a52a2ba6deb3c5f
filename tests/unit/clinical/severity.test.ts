import { gradeThighContusion } from '../../../shared/clinical/severity';
import { publishedTimeLost } from '../../../shared/clinical/time-lost';

// Bands: Ryan JB et al., Quadriceps contusions: West Point update, Am J Sports Med 1991;19(3):299–304 —
// mild > 90°, moderate 45°–90°, severe < 45° of active knee flexion. Boundary placement (45 and 90 both
// moderate) is Mendstep's choice, recorded in clinical-sources.md.
const inWindow = 24; // hours; Ryan et al. 1991 measured 12–24 h after injury

describe('gradeThighContusion', () => {
  it('grades 91° of knee flexion as mild', () => {
    expect(gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 91, hoursSinceInjury: inWindow })?.grade).toBe(
      'mild', // Ryan et al. 1991: mild > 90°
    );
  });

  it('grades exactly 90° as moderate, not mild', () => {
    expect(gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 90, hoursSinceInjury: inWindow })?.grade).toBe(
      'moderate', // Ryan et al. 1991: moderate 45°–90°; 90 inclusive is Mendstep's boundary choice
    );
  });

  it('grades exactly 45° as moderate, not severe', () => {
    expect(gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 45, hoursSinceInjury: inWindow })?.grade).toBe(
      'moderate', // Ryan et al. 1991: moderate 45°–90°; 45 inclusive is Mendstep's boundary choice
    );
  });

  it('grades 44° of knee flexion as severe', () => {
    expect(gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 44, hoursSinceInjury: inWindow })?.grade).toBe(
      'severe', // Ryan et al. 1991: severe < 45°
    );
  });

  it('names Ryan et al. 1991 as the source of the grade', () => {
    const result = gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 60, hoursSinceInjury: inWindow });
    expect(result?.source).toContain('Am J Sports Med 1991;19(3):299–304'); // Ryan et al. 1991 journal reference
  });

  it('does not grade regions other than the anterior thigh', () => {
    // decisions.md: grading by knee flexion applies to the anterior (quadriceps) region only
    expect(gradeThighContusion({ region: 'lateral-thigh', kneeFlexionDeg: 30, hoursSinceInjury: inWindow })).toBeNull();
    expect(gradeThighContusion({ region: 'posterior-thigh', kneeFlexionDeg: 30, hoursSinceInjury: inWindow })).toBeNull();
    expect(gradeThighContusion({ region: 'calf', kneeFlexionDeg: 30, hoursSinceInjury: inWindow })).toBeNull();
  });

  it('does not grade an anterior thigh without a knee-flexion value', () => {
    expect(gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: null, hoursSinceInjury: inWindow })).toBeNull();
    expect(gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: undefined })).toBeNull();
  });

  describe('timing of the measurement', () => {
    // Window 12–48 h: Ryan et al. 1991 measured at 12–24 h; Jackson & Feagin 1973 (J Bone Joint Surg Am,
    // volume/pages from memory, secondary) at 24–48 h.
    it('warns when knee flexion was measured 11.9 hours after injury', () => {
      const result = gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 100, hoursSinceInjury: 11.9 });
      expect(result?.timingWarning).toMatch(/12–48 h/);
    });

    it('does not warn at exactly 12 hours', () => {
      const result = gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 100, hoursSinceInjury: 12 });
      expect(result?.timingWarning).toBeUndefined();
    });

    it('does not warn at exactly 48 hours', () => {
      const result = gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 100, hoursSinceInjury: 48 });
      expect(result?.timingWarning).toBeUndefined();
    });

    it('warns when knee flexion was measured 48.1 hours after injury, and still grades', () => {
      const result = gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 100, hoursSinceInjury: 48.1 });
      expect(result?.timingWarning).toMatch(/approximate/);
      expect(result?.grade).toBe('mild'); // Ryan et al. 1991: mild > 90°
    });

    it('warns when the measurement is dated before the injury', () => {
      const result = gradeThighContusion({ region: 'anterior-thigh', kneeFlexionDeg: 100, hoursSinceInjury: -1 });
      expect(result?.timingWarning).toMatch(/before the recorded injury time/);
    });
  });
});

describe('publishedTimeLost', () => {
  it.each([
    ['mild', 13], // Ryan et al. 1991, Am J Sports Med 19(3):299–304: mean disability, mild
    ['moderate', 19], // Ryan et al. 1991: mean disability, moderate
    ['severe', 21], // Ryan et al. 1991: mean disability, severe
  ] as const)('gives the published mean for a %s contusion as %i days', (grade, days) => {
    const result = publishedTimeLost(grade);
    expect(result?.meanDays).toBe(days);
    expect(result?.wording).toContain(`${days} days`);
  });

  it('words the figure as a group average, not a prediction for this athlete', () => {
    const wording = publishedTimeLost('moderate')?.wording ?? '';
    expect(wording).toMatch(/Published mean/);
    expect(wording).toMatch(/not a prediction for this athlete/);
  });

  it('gives nothing when there is no grade', () => {
    expect(publishedTimeLost(null)).toBeNull();
  });
});
