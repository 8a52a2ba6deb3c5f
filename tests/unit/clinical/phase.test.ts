import { DateTime } from 'luxon';
import { suggestPhase, type SuggestPhaseInput } from '../../../shared/clinical/phase';

const injuredAt = '2025-04-01T18:00:00Z';
const at = (hours: number) => DateTime.fromISO(injuredAt, { zone: 'utc' }).plus({ hours }).toISO()!;
const base: SuggestPhaseInput = { injuredAt, now: injuredAt, grade: null, swellingIncreased: false, override: null };

function phaseAt(hours: number, extra: Partial<SuggestPhaseInput> = {}) {
  return suggestPhase({ ...base, now: at(hours), ...extra });
}

describe('suggestPhase', () => {
  describe('day bands', () => {
    // Kannus P, Phys Sportsmed 2000;28(3): inflammation 0–7 days, proliferation 7–21, remodelling > 21;
    // decisions.md: day 0 to before day 7 acute, day 7 to before day 21 proliferative, day 21 on remodelling.
    it('is acute on day 0', () => {
      expect(phaseAt(0).suggestedPhase).toBe('acute'); // Kannus 2000
    });

    it('is still acute one minute before day 7', () => {
      expect(phaseAt(7 * 24 - 1 / 60).suggestedPhase).toBe('acute'); // Kannus 2000: acute up to day 7
    });

    it('is proliferative from the start of day 7', () => {
      const result = phaseAt(7 * 24);
      expect(result.suggestedPhase).toBe('proliferative'); // Kannus 2000: proliferation from day 7
      expect(result.daysSinceInjury).toBe(7);
    });

    it('is still proliferative one minute before day 21', () => {
      expect(phaseAt(21 * 24 - 1 / 60).suggestedPhase).toBe('proliferative'); // Kannus 2000: proliferation to day 21
    });

    it('is remodelling from the start of day 21', () => {
      expect(phaseAt(21 * 24).suggestedPhase).toBe('remodelling'); // Kannus 2000: remodelling beyond day 21
    });

    it('explains the band in plain language', () => {
      expect(phaseAt(3 * 24).reason).toBe('Day 3 since injury: days 0 to 6 are the acute phase (Kannus 2000).');
    });
  });

  describe('adjustments by signs', () => {
    // Common practice: the acute phase lasts a day to a week depending on severity; no massage for 24–72 h.
    it('lets a mild contusion leave the acute phase at 48 hours when swelling has not increased', () => {
      expect(phaseAt(48, { grade: 'mild' }).suggestedPhase).toBe('proliferative'); // common practice, 48 h
    });

    it('keeps a mild contusion acute just before 48 hours', () => {
      expect(phaseAt(47.9, { grade: 'mild' }).suggestedPhase).toBe('acute'); // common practice, 48 h
    });

    it('keeps a moderate contusion acute after 48 hours', () => {
      expect(phaseAt(72, { grade: 'moderate' }).suggestedPhase).toBe('acute'); // Kannus 2000 band; the 48 h exit is for mild only
    });

    it('keeps a mild contusion acute when swelling increased', () => {
      // Common practice: if swelling increases, return to cold and compression
      const result = phaseAt(60, { grade: 'mild', swellingIncreased: true });
      expect(result.suggestedPhase).toBe('acute');
      expect(result.reason).toMatch(/swelling has increased/);
    });

    it('returns a day-10 injury to acute when swelling increased', () => {
      expect(phaseAt(10 * 24, { swellingIncreased: true }).suggestedPhase).toBe('acute'); // common practice
    });
  });

  describe('override', () => {
    it('uses the therapist override over the suggestion and says so', () => {
      const result = phaseAt(2 * 24, { override: { phase: 'proliferative', reason: 'Bruise resolving fast, full range.' } });
      expect(result.suggestedPhase).toBe('acute'); // Kannus 2000: day 2 is in the acute band
      expect(result.phase).toBe('proliferative');
      expect(result.isOverride).toBe(true);
      expect(result.reason).toBe(
        'Set to proliferative by the therapist: Bruise resolving fast, full range. Suggested from time and signs: acute.',
      );
    });

    it('wins even over increased swelling', () => {
      const result = phaseAt(30 * 24, { swellingIncreased: true, override: { phase: 'remodelling', reason: 'Post-training pump' } });
      expect(result.phase).toBe('remodelling');
      expect(result.suggestedPhase).toBe('acute'); // common practice: swelling increased → back to acute
    });

    it('is not an override when none is set', () => {
      const result = phaseAt(10 * 24);
      expect(result.isOverride).toBe(false);
      expect(result.phase).toBe(result.suggestedPhase);
    });
  });

  it('treats an injury time a few minutes ahead of now as day 0', () => {
    // records schemas allow a few minutes of clock skew (a choice of ours)
    expect(phaseAt(-0.05).daysSinceInjury).toBe(0);
  });
});
