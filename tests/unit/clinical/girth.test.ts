import { girthDifferenceCm, summariseGirth, type GirthMeasurement } from '../../../shared/clinical/girth';
import { defaultClinicSettings } from '../../../shared/clinic/settings';

// Threshold: the clinic's setting, default 1.0 cm (a default of ours from common practice; no published
// minimal detectable change for limb girth was found — clinical-sources.md).
const threshold = defaultClinicSettings.swellingThresholdCm;
const site = { girthLandmark: 'Superior pole of patella', girthDistanceCm: 20 }; // 20 cm above: Harrelson et al., J Sport Rehabil 1998;7(4) (title not retrieved)

function girth(takenAt: string, injured: number, other: number, extra: Partial<GirthMeasurement> = {}): GirthMeasurement {
  return { takenAt, girthInjuredCm: injured, girthOtherCm: other, ...site, ...extra };
}

describe('girthDifferenceCm', () => {
  it('is the injured side minus the other side', () => {
    expect(girthDifferenceCm(girth('2025-05-01T10:00:00Z', 52.4, 50.1))).toBe(2.3);
  });

  it('is null when a side is missing', () => {
    expect(girthDifferenceCm({ takenAt: '2025-05-01T10:00:00Z', girthInjuredCm: 52 })).toBeNull();
  });
});

describe('summariseGirth', () => {
  it('uses the latest two girths whatever order they arrive in', () => {
    const result = summariseGirth(
      [girth('2025-05-03T10:00:00Z', 53, 50), girth('2025-05-01T10:00:00Z', 51, 50), girth('2025-05-02T10:00:00Z', 52, 50)],
      threshold,
    );
    expect(result.latest?.takenAt).toBe('2025-05-03T10:00:00.000Z');
    expect(result.previous?.takenAt).toBe('2025-05-02T10:00:00.000Z');
    expect(result.changeDifferenceCm).toBe(1);
  });

  it('does not count a rise of exactly the threshold as increased swelling', () => {
    const result = summariseGirth([girth('2025-05-01T10:00:00Z', 45.1, 44), girth('2025-05-02T10:00:00Z', 46.1, 44)], threshold);
    expect(result.changeDifferenceCm).toBe(1); // not 1.0000000000000014
    expect(result.swellingIncreased).toBe(false); // clinic setting, default 1.0 cm (ours): "more than" the threshold
  });

  it('counts a rise of 1.1 cm as increased swelling at the default threshold', () => {
    const result = summariseGirth([girth('2025-05-01T10:00:00Z', 45, 44), girth('2025-05-02T10:00:00Z', 46.1, 44)], threshold);
    expect(result.swellingIncreased).toBe(true); // clinic setting, default 1.0 cm (ours)
    expect(result.thresholdSource).toMatch(/not a published figure/);
  });

  it('follows the clinic threshold when it is changed', () => {
    const measurements = [girth('2025-05-01T10:00:00Z', 45, 44), girth('2025-05-02T10:00:00Z', 46.1, 44)];
    expect(summariseGirth(measurements, 1.5).swellingIncreased).toBe(false); // a clinic's own setting of 1.5 cm
  });

  it('judges swelling by the side-to-side difference, not the injured side alone', () => {
    // Both limbs measured 2 cm larger: the difference is unchanged, so no swelling increase.
    const result = summariseGirth([girth('2025-05-01T10:00:00Z', 50, 48), girth('2025-05-02T10:00:00Z', 52, 50)], threshold);
    expect(result.changeInjuredCm).toBe(2);
    expect(result.changeDifferenceCm).toBe(0);
    expect(result.swellingIncreased).toBe(false);
  });

  it('does not compare girths taken at different sites', () => {
    const result = summariseGirth(
      [girth('2025-05-01T10:00:00Z', 45, 44), girth('2025-05-02T10:00:00Z', 49, 44, { girthDistanceCm: 15 })],
      threshold,
    );
    expect(result.changeDifferenceCm).toBeNull();
    expect(result.swellingIncreased).toBe(false);
    expect(result.note).toMatch(/different sites/);
  });

  it('treats landmark spelling differences of case and spacing as the same site', () => {
    const result = summariseGirth(
      [girth('2025-05-01T10:00:00Z', 45, 44), girth('2025-05-02T10:00:00Z', 47, 44, { girthLandmark: ' superior  pole of Patella ' })],
      threshold,
    );
    expect(result.swellingIncreased).toBe(true); // 2 cm rise > default 1.0 cm (clinic default of ours)
  });

  it('reports no change with a single girth', () => {
    const result = summariseGirth([girth('2025-05-01T10:00:00Z', 45, 44), { takenAt: '2025-05-02T10:00:00Z' }], threshold);
    expect(result.latest?.differenceCm).toBe(1);
    expect(result.previous).toBeNull();
    expect(result.changeDifferenceCm).toBeNull();
  });
});
