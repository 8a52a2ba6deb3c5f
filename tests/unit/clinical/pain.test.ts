import { latestPainChange, painChange } from '../../../shared/clinical/pain';

// Farrar JT, Young JP, LaMoreaux L, Werth JL, Poole RM. Pain 2001;94(2):149–158: a change of about 2 points
// or about 30 % on the 0–10 NPRS was clinically important (measured in chronic pain).
describe('painChange', () => {
  it('counts a 2-point fall as clinically important', () => {
    const result = painChange(7, 5); // 28.6 %, below 30 %, so only the 2-point rule applies
    expect(result.change).toBe(-2);
    expect(result.percentChange).toBe(-28.6);
    expect(result.clinicallyImportant).toBe(true); // Farrar et al. 2001: ≥ 2 points
    expect(result.direction).toBe('better');
  });

  it('counts a 30 % fall as clinically important even when it is under 2 points', () => {
    const result = painChange(3, 2); // 1 point, 33.3 %
    expect(result.percentChange).toBe(-33.3);
    expect(result.clinicallyImportant).toBe(true); // Farrar et al. 2001: ≥ 30 %
  });

  it('computes 10 → 7 as exactly −30 %', () => {
    expect(painChange(10, 7).percentChange).toBe(-30); // not −30.000000000000004
  });

  it('counts exactly 30 % as clinically important when the fall is under 2 points', () => {
    // Whole NPRS scores cannot give exactly 30 % under 2 points, so a half point checks the boundary itself.
    const result = painChange(5, 3.5);
    expect(result.percentChange).toBe(-30);
    expect(result.clinicallyImportant).toBe(true); // Farrar et al. 2001: ≥ 30 %
  });

  it('does not count a 1-point, 25 % fall as clinically important', () => {
    expect(painChange(4, 3).clinicallyImportant).toBe(false); // Farrar et al. 2001: below 2 points and below 30 %
  });

  it('does not count a 1-point, 14.3 % fall as clinically important', () => {
    expect(painChange(7, 6).clinicallyImportant).toBe(false); // Farrar et al. 2001: below both thresholds
  });

  it('flags a 2-point rise as worse and clinically important', () => {
    const result = painChange(3, 5);
    expect(result.direction).toBe('worse');
    expect(result.clinicallyImportant).toBe(true); // Farrar et al. 2001 thresholds, applied to a rise by Mendstep
  });

  it('gives no percentage from a previous score of 0 and relies on points', () => {
    const result = painChange(0, 1);
    expect(result.percentChange).toBeNull();
    expect(result.clinicallyImportant).toBe(false); // Farrar et al. 2001: 1 point is below 2 points
  });

  it('says the thresholds were measured in chronic pain', () => {
    const result = painChange(6, 6);
    expect(result.direction).toBe('unchanged');
    expect(result.note).toMatch(/measured in chronic pain/);
    expect(result.source).toContain('Pain 2001;94(2):149–158');
  });
});

describe('latestPainChange', () => {
  it('compares the two most recent pain scores whatever order they arrive in', () => {
    const result = latestPainChange([
      { takenAt: '2025-05-03T10:00:00Z', painNprs: 3 },
      { takenAt: '2025-05-01T10:00:00Z', painNprs: 8 },
      { takenAt: '2025-05-04T10:00:00Z', painNprs: null },
      { takenAt: '2025-05-02T10:00:00Z', painNprs: 6 },
    ]);
    expect(result).toMatchObject({ previous: 6, latest: 3, change: -3 });
  });

  it('gives nothing with fewer than two pain scores', () => {
    expect(latestPainChange([{ takenAt: '2025-05-03T10:00:00Z', painNprs: 3 }])).toBeNull();
  });
});
