import { stepKindInfo, stepKinds, boundsMessage, isWithinBounds } from '../../../shared/plan/step-kinds';

const kindsWhere = (test: (kind: (typeof stepKinds)[number]) => boolean) => stepKinds.filter(test);

describe('step kinds', () => {
  it('a cold pack is bounded at 20 minutes of continuous cold', () => {
    // 1200 s = no continuous cold over 20 min: common practice.
    expect(stepKindInfo['cold-pack'].bounds.max).toBe(1200);
    expect(isWithinBounds('cold-pack', 1200)).toBe(true);
    expect(isWithinBounds('cold-pack', 1201)).toBe(false);
  });

  it('ice massage is bounded at 5 to 7 minutes', () => {
    // 300–420 s = ice massage 5–7 min at a time: common practice.
    expect(stepKindInfo['ice-massage'].bounds).toEqual({ min: 300, max: 420 });
    expect(isWithinBounds('ice-massage', 299)).toBe(false);
    expect(isWithinBounds('ice-massage', 421)).toBe(false);
  });

  it('only the cold pack and ice massage are cold', () => {
    expect(kindsWhere((kind) => stepKindInfo[kind].cold)).toEqual(['cold-pack', 'ice-massage']);
  });

  it('friction, broadening and stripping are the deep work kept away from suspected myositis ossificans', () => {
    // Deep work locally contraindicated where myositis ossificans is suspected: Phys Sportsmed 1995;23(2):77–82
    // (authors and title not retrieved).
    expect(kindsWhere((kind) => stepKindInfo[kind].deepWork)).toEqual([
      'cross-fibre-friction',
      'multidirectional-friction',
      'passive-broadening',
      'active-broadening',
      'passive-stripping',
      'active-stripping',
    ]);
  });

  it('the wrap and the rest and re-check wait for the therapist to confirm, with a question to answer', () => {
    const confirmKinds = kindsWhere((kind) => stepKindInfo[kind].needsConfirm);
    expect(confirmKinds).toEqual(['compression-wrap', 'rest-recheck']);
    for (const kind of confirmKinds) expect(stepKindInfo[kind].confirmPrompt).toMatch(/\?$/);
  });

  it('every cue is one short line that reads from two metres', () => {
    // 60 characters on one line: a layout choice of ours for table mode, not a published figure.
    for (const kind of stepKinds) {
      expect(stepKindInfo[kind].cue, kind).not.toMatch(/\n/);
      expect(stepKindInfo[kind].cue.length, kind).toBeLessThanOrEqual(60);
    }
  });

  it('every kind has sane bounds and says where they come from', () => {
    for (const kind of stepKinds) {
      const { min, max } = stepKindInfo[kind].bounds;
      expect(min, kind).toBeGreaterThan(0);
      expect(max, kind).toBeGreaterThan(min);
      expect(stepKindInfo[kind].boundsSource, kind).toMatch(/common practice|clinic default of ours/);
    }
  });

  it('the bounds message names the allowed range in seconds and minutes', () => {
    expect(boundsMessage('ice-massage')).toBe('Ice massage must last between 300 and 420 seconds (5–7 min)');
  });

  it('a fraction of a second is out of bounds', () => {
    expect(isWithinBounds('light-strokes', 120.5)).toBe(false);
  });
});
