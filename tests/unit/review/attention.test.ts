import { iceMassageBounds, runAttention, type StepEntryLike } from '../../../shared/review/attention';

const entry = (over: Partial<StepEntryLike>): StepEntryLike => ({ type: 'step-completed', stepIndex: 0, kind: 'light-strokes', actualSeconds: 300, detail: null, ...over });

describe('which runs need attention', () => {
  it('takes the ice-massage bounds from the step kind: 5–7 minutes (common practice)', () => {
    expect(iceMassageBounds).toEqual({ min: 300, max: 420 });
  });

  it('a completed run without departures needs none', () => {
    expect(runAttention('completed', [entry({ kind: 'ice-massage', actualSeconds: 360 })])).toEqual([]);
  });

  it('flags a fall back, a red flag, an abandoned and an early-ended run by their status', () => {
    expect(runAttention('fell-back', [])).toEqual(['fell-back']);
    expect(runAttention('stopped-referred', [])).toEqual(['red-flag']);
    expect(runAttention('abandoned', [])).toEqual(['abandoned']);
    expect(runAttention('ended-early', [])).toEqual(['ended-early']);
  });

  it('flags ice massage over 7 minutes or under 5, but not an interrupted one', () => {
    expect(runAttention('completed', [entry({ kind: 'ice-massage', actualSeconds: 450 })])).toEqual(['ice-massage-out-of-bounds']);
    expect(runAttention('completed', [entry({ kind: 'ice-massage', actualSeconds: 240 })])).toEqual(['ice-massage-out-of-bounds']);
    expect(runAttention('fell-back', [entry({ type: 'step-interrupted', kind: 'ice-massage', actualSeconds: 60 })])).toEqual(['fell-back']);
  });

  it('flags a skipped required step, not a skipped optional one', () => {
    expect(runAttention('completed', [entry({ type: 'step-skipped', detail: 'required step' })])).toEqual(['skipped-steps']);
    expect(runAttention('completed', [entry({ type: 'step-skipped', detail: 'optional step' })])).toEqual([]);
  });

  it('lists several flags in a fixed order', () => {
    const flags = runAttention('ended-early', [entry({ type: 'step-skipped', detail: 'required step' }), entry({ kind: 'ice-massage', actualSeconds: 500 })]);
    expect(flags).toEqual(['skipped-steps', 'ice-massage-out-of-bounds', 'ended-early']);
  });
});
