import { adherenceFigures, adherenceReport, type AdherenceRun } from '../../../shared/review/adherence';
import type { StepEntryLike } from '../../../shared/review/attention';

const done = (stepIndex: number | null, kind: string, actualSeconds: number): StepEntryLike => ({ type: 'step-completed', stepIndex, kind, actualSeconds, detail: null });
const skipped = (stepIndex: number, kind: string, optional: boolean): StepEntryLike => ({
  type: 'step-skipped',
  stepIndex,
  kind,
  actualSeconds: 0,
  detail: optional ? 'optional step' : 'required step',
});

/*
 * Hand-computed fixture. Ice massage within 5–7 minutes (300–420 s, common practice):
 *   ana run 1 (proliferative, completed): ice 360 ✓, strokes, movement, ice 300 ✓ (the edge counts)  → 4 steps
 *   ana run 2 (proliferative, fell back): ice 421 ✗, strokes interrupted, back-to-cold cold pack + wrap → 2 plan steps
 *   ben run 3 (remodelling, completed): 7 deep steps, optional ice skipped (not a skip)               → 8 steps
 *   ben run 4 (acute, ended early): cold pack, wrap skipped (required)                                 → 2 steps
 * Clinic: runs 4; ice 3 completed, 2 within → 2/3; fallbacks 1 → 1/4; required skips 1 of 16 plan steps reached.
 */
const runs: AdherenceRun[] = [
  {
    therapistId: 'ana',
    phase: 'proliferative',
    status: 'completed',
    entries: [done(0, 'ice-massage', 360), done(1, 'light-strokes', 300), done(2, 'passive-movement', 180), done(3, 'ice-massage', 300), { type: 'run-completed', kind: null, actualSeconds: null }],
  },
  {
    therapistId: 'ana',
    phase: 'proliferative',
    status: 'fell-back',
    entries: [
      done(0, 'ice-massage', 421),
      { type: 'step-interrupted', stepIndex: 1, kind: 'light-strokes', actualSeconds: 90, detail: null },
      { type: 'swelling-check', stepIndex: 1, kind: 'light-strokes', actualSeconds: null, detail: 'increased' },
      done(null, 'cold-pack', 1200),
      done(null, 'compression-wrap', 180),
    ],
  },
  {
    therapistId: 'ben',
    phase: 'remodelling',
    status: 'completed',
    entries: [
      ...['warm-up-strokes', 'cross-fibre-friction', 'multidirectional-friction', 'passive-broadening', 'active-broadening', 'passive-stripping', 'active-stripping'].map((kind, i) => done(i, kind, 120)),
      skipped(7, 'ice-massage', true),
    ],
  },
  { therapistId: 'ben', phase: 'acute', status: 'ended-early', entries: [done(0, 'cold-pack', 1200), skipped(1, 'compression-wrap', false)] },
];

describe('adherence figures', () => {
  it('computes the clinic figures of the hand-computed fixture', () => {
    const figures = adherenceFigures(runs);
    expect(figures).toEqual({
      runs: 4,
      iceMassageSteps: 3,
      iceMassageWithinBounds: 2,
      iceMassageShare: 2 / 3,
      fallbacks: 1,
      fallbackRate: 0.25,
      skippedSteps: 1,
      totalSteps: 16,
      skippedRate: 1 / 16,
      runsPerPhase: { acute: 1, proliferative: 2, remodelling: 1 },
    });
  });

  it('counts ice massage of exactly 300 s and 420 s as within 5–7 minutes (common practice), 299 s and 421 s as outside', () => {
    const edge = (seconds: number): AdherenceRun => ({ therapistId: 'x', phase: 'proliferative', status: 'completed', entries: [done(0, 'ice-massage', seconds)] });
    expect(adherenceFigures([edge(300), edge(420)]).iceMassageWithinBounds).toBe(2);
    expect(adherenceFigures([edge(299), edge(421)]).iceMassageWithinBounds).toBe(0);
  });

  it('has no ice-massage share without ice massage, and zero rates without runs', () => {
    const figures = adherenceFigures([]);
    expect(figures.iceMassageShare).toBeNull();
    expect(figures.fallbackRate).toBe(0);
    expect(figures.skippedRate).toBe(0);
    expect(figures.runsPerPhase).toEqual({ acute: 0, proliferative: 0, remodelling: 0 });
  });

  it('gives each therapist their own figures, in name order', () => {
    const report = adherenceReport(runs, new Map([['ana', 'Zoe Ana'], ['ben', 'Ben Moss']]), { from: 'a', to: 'b' });
    expect(report.therapists.map((t) => t.name)).toEqual(['Ben Moss', 'Zoe Ana']);
    const [ben, ana] = report.therapists;
    expect(ana).toMatchObject({ therapistId: 'ana', runs: 2, iceMassageSteps: 3, iceMassageWithinBounds: 2, fallbacks: 1, fallbackRate: 0.5, totalSteps: 6, skippedSteps: 0 });
    expect(ben).toMatchObject({ therapistId: 'ben', runs: 2, iceMassageSteps: 0, iceMassageShare: null, fallbacks: 0, totalSteps: 10, skippedSteps: 1, skippedRate: 0.1 });
    expect(report.clinic.runs).toBe(4);
  });
});
