import { describe, expect, it } from 'vitest';
import { largestPadCm, oversizePadNote, padSize } from '../../../shared/clinical/pad-size';
import { buildPlan } from '../../../shared/plan/build-plan';
import { defaultSequences } from '../../../shared/plan/sequence';

const acute = { phase: 'acute' as const, sequence: defaultSequences.acute, tolerance: 'usual' as const, coldContraindicated: false, suspectedMyositis: false };

describe('a bruise larger than the pad table allows', () => {
  it('gets the largest pad, with a note, for the largest bruise a measurement accepts (60 × 60 cm)', () => {
    const pad = padSize({ bruiseLengthCm: 60, bruiseWidthCm: 60 })!;
    expect(pad.oversize).toBe(true);
    expect(pad.length).toEqual({ minCm: largestPadCm, maxCm: largestPadCm });
    expect(pad.width.maxCm).toBe(largestPadCm);
    expect(pad.note).toContain(oversizePadNote);
  });

  it('keeps the range where only its top is too large, and a small bruise has no note', () => {
    const pad = padSize({ bruiseLengthCm: 40, bruiseWidthCm: 10 })!;
    expect(pad.length).toEqual({ minCm: 80, maxCm: largestPadCm });
    expect(pad.width).toEqual({ minCm: 20, maxCm: 30 });
    expect(pad.oversize).toBe(true);
    const small = padSize({ bruiseLengthCm: 6, bruiseWidthCm: 4 })!;
    expect(small.oversize).toBe(false);
    expect(small.note).not.toContain(oversizePadNote);
  });

  it('buildPlan given a pad past the table builds the plan with the largest pad and the note as a caution', () => {
    const plan = buildPlan({ ...acute, padSize: { minLengthCm: 120, maxLengthCm: 180, minWidthCm: 20, maxWidthCm: 30 } });
    expect(plan.padSize).toEqual({ minLengthCm: largestPadCm, maxLengthCm: largestPadCm, minWidthCm: 20, maxWidthCm: 30 });
    expect(plan.cautions).toContain(oversizePadNote);
    expect(plan.steps.find((s) => s.kind === 'compression-wrap')?.cue).toMatch(/^Felt pad 100 × 20/);
  });

  it('buildPlan says so when the assessment already capped the pad', () => {
    const pad = padSize({ bruiseLengthCm: 60, bruiseWidthCm: 60 })!;
    const plan = buildPlan({
      ...acute,
      padSize: { minLengthCm: pad.length.minCm, maxLengthCm: pad.length.maxCm, minWidthCm: pad.width.minCm, maxWidthCm: pad.width.maxCm },
      padOversize: pad.oversize,
    });
    expect(plan.cautions).toContain(oversizePadNote);
    expect(buildPlan({ ...acute, padSize: { minLengthCm: 12, maxLengthCm: 18, minWidthCm: 8, maxWidthCm: 12 } }).cautions).not.toContain(oversizePadNote);
  });
});
