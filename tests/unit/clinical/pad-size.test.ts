import { padSize } from '../../../shared/clinical/pad-size';

// Common practice: a felt pad two to three times the size of the injury; Mendstep reads "size" as each
// linear dimension and rounds to 0.5 cm.
describe('padSize', () => {
  it('makes the pad two to three times the bruise length and width', () => {
    const result = padSize({ bruiseLengthCm: 8, bruiseWidthCm: 5 });
    expect(result?.length).toEqual({ minCm: 16, maxCm: 24 }); // common practice: 2× and 3× of 8 cm
    expect(result?.width).toEqual({ minCm: 10, maxCm: 15 }); // common practice: 2× and 3× of 5 cm
  });

  it('rounds each figure to the nearest half centimetre', () => {
    const result = padSize({ bruiseLengthCm: 3.3, bruiseWidthCm: 2.1 });
    expect(result?.length).toEqual({ minCm: 6.5, maxCm: 10 }); // 6.6 → 6.5, 9.9 → 10 (common practice × rounding of ours)
    expect(result?.width).toEqual({ minCm: 4, maxCm: 6.5 }); // 4.2 → 4, 6.3 → 6.5 (common practice × rounding of ours)
  });

  it('gives no pad without both bruise dimensions', () => {
    expect(padSize({ bruiseLengthCm: 6, bruiseWidthCm: null })).toBeNull();
    expect(padSize({ bruiseLengthCm: undefined, bruiseWidthCm: 4 })).toBeNull();
    expect(padSize({ bruiseLengthCm: 0, bruiseWidthCm: 0 })).toBeNull();
  });

  it('includes wrap guidance from below to above the injury, with its sources', () => {
    const guidance = padSize({ bruiseLengthCm: 4, bruiseWidthCm: 3 })?.wrapGuidance ?? [];
    const texts = guidance.map((g) => g.text).join(' ');
    expect(texts).toMatch(/below the injury/); // NHS inform PRICE: wrap from the end furthest from the heart
    expect(texts).toMatch(/figure-of-eight/); // common practice
    expect(texts).toMatch(/Finish above the injury/); // common practice
    expect(texts).toMatch(/Loosen the wrap if pain increases or the area goes numb/); // NHS inform PRICE guidance
    expect(guidance.every((g) => g.source.length > 0)).toBe(true);
    expect(guidance.some((g) => g.source.includes('NHS inform'))).toBe(true);
  });
});
