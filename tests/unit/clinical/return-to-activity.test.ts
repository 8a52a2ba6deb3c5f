import { functionalTestIds, returnToActivityCheck, type RtaMeasurement } from '../../../shared/clinical/return-to-activity';

// Knee flexion ≥ 120° as the return criterion: Aronen JG, Chronister RD, Phys Sportsmed 1992;20(7):130–136.
// Girth difference: within the clinic's threshold (a clinic setting, 1.0 cm by default; not a published figure).
// Pain at rest 0 on the NPRS and the functional tests: common practice.
const threshold = 1.0;
const allTests = [...functionalTestIds];
const m = (takenAt: string, values: Partial<RtaMeasurement>): RtaMeasurement => ({ takenAt, ...values });
const recovered = { kneeFlexionDeg: 135, girthInjuredCm: 52.4, girthOtherCm: 52.0, painNprs: 0 };

function statusOf(check: ReturnType<typeof returnToActivityCheck>, id: string) {
  return check.criteria.find((c) => c.id === id)?.status;
}

describe('return-to-activity check', () => {
  it('passes an anterior-thigh contusion with 120° of knee flexion, equal girths, no pain at rest and every test passed', () => {
    const check = returnToActivityCheck({
      region: 'anterior-thigh',
      measurements: [m('2026-11-20T10:00:00Z', { ...recovered, kneeFlexionDeg: 120 })], // exactly 120°: Aronen & Chronister 1992, ≥ 120°
      girthThresholdCm: threshold,
      passedTests: allTests,
    });
    expect(check.allMet).toBe(true);
    expect(check.unmet).toEqual([]);
    expect(check.criteria.find((c) => c.id === 'knee-flexion')?.source).toContain('Phys Sportsmed 1992;20(7):130–136');
  });

  it('fails 119° of knee flexion (Aronen & Chronister 1992: 120° needed)', () => {
    const check = returnToActivityCheck({ region: 'anterior-thigh', measurements: [m('2026-11-20T10:00:00Z', { ...recovered, kneeFlexionDeg: 119 })], girthThresholdCm: threshold, passedTests: allTests });
    expect(statusOf(check, 'knee-flexion')).toBe('unmet');
    expect(check.allMet).toBe(false);
  });

  it('reads every criterion from the latest measurement, whatever order the measurements come in', () => {
    const measurements = [
      m('2026-11-25T09:00:00Z', { kneeFlexionDeg: 100, girthInjuredCm: 54.0, girthOtherCm: 52.0, painNprs: 2 }), // latest: not there yet
      m('2026-11-20T09:00:00Z', recovered), // earlier: would have passed
    ];
    const check = returnToActivityCheck({ region: 'anterior-thigh', measurements, girthThresholdCm: threshold, passedTests: allTests });
    expect(check.measurement?.takenAt).toBe('2026-11-25T09:00:00.000Z');
    expect(statusOf(check, 'knee-flexion')).toBe('unmet');
    expect(statusOf(check, 'girth-difference')).toBe('unmet'); // 2.0 cm > the clinic's 1.0 cm
    expect(statusOf(check, 'pain-at-rest')).toBe('unmet');

    const reversed = returnToActivityCheck({ region: 'anterior-thigh', measurements: [measurements[1], m('2026-11-26T09:00:00Z', recovered), measurements[0]], girthThresholdCm: threshold, passedTests: allTests });
    expect(reversed.allMet).toBe(true);
  });

  it('does not borrow a value missing from the latest measurement from an earlier one', () => {
    const check = returnToActivityCheck({
      region: 'anterior-thigh',
      measurements: [m('2026-11-20T09:00:00Z', recovered), m('2026-11-22T09:00:00Z', { painNprs: 0 })],
      girthThresholdCm: threshold,
      passedTests: allTests,
    });
    expect(statusOf(check, 'knee-flexion')).toBe('not-measured');
    expect(statusOf(check, 'girth-difference')).toBe('not-measured');
    expect(statusOf(check, 'pain-at-rest')).toBe('met');
    expect(check.allMet).toBe(false);
  });

  it("compares the side-to-side girth difference with the clinic's threshold, either way round", () => {
    const within = (injured: number, other: number, thresholdCm: number) =>
      statusOf(returnToActivityCheck({ region: 'anterior-thigh', measurements: [m('2026-11-20T09:00:00Z', { ...recovered, girthInjuredCm: injured, girthOtherCm: other })], girthThresholdCm: thresholdCm, passedTests: allTests }), 'girth-difference');
    expect(within(53.0, 52.0, 1.0)).toBe('met'); // 1.0 cm at a 1.0 cm threshold: within
    expect(within(53.1, 52.0, 1.0)).toBe('unmet');
    expect(within(50.5, 52.0, 1.0)).toBe('unmet'); // wasting is outside it too
    expect(within(53.1, 52.0, 1.5)).toBe('met'); // the clinic's own setting decides
  });

  it('asks only pain at rest and the functional tests of a calf contusion: knee flexion and girth are anterior-thigh criteria', () => {
    const check = returnToActivityCheck({ region: 'calf', measurements: [m('2026-11-20T09:00:00Z', { painNprs: 0 })], girthThresholdCm: threshold, passedTests: allTests });
    expect(check.criteria.map((c) => c.id)).toEqual(['pain-at-rest', ...allTests.map((id) => `functional:${id}`)]);
    expect(check.allMet).toBe(true);
  });

  it('needs every functional test ticked, and pain at rest exactly 0', () => {
    const check = returnToActivityCheck({ region: 'calf', measurements: [m('2026-11-20T09:00:00Z', { painNprs: 1 })], girthThresholdCm: threshold, passedTests: allTests.slice(1) });
    expect(check.unmet.map((c) => c.id)).toEqual(['pain-at-rest', `functional:${allTests[0]}`]);
  });

  it('without any measurement, every measured criterion is "not measured"', () => {
    const check = returnToActivityCheck({ region: 'anterior-thigh', measurements: [], girthThresholdCm: threshold, passedTests: allTests });
    expect(check.measurement).toBeNull();
    expect(check.unmet.map((c) => c.status)).toEqual(['not-measured', 'not-measured', 'not-measured']);
  });
});
