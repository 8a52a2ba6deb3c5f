import type { Phase } from '../phase';
import type { PhaseOverride } from '../records/injury';
import { msPerDay, msPerHour, toMillis, type Instant } from './instant';
import type { SeverityGrade } from './severity';

/** Day bands from Kannus 2000: inflammation 0–7 days, proliferation 7–21, remodelling beyond 21. */
export const phaseDayBands = { proliferativeFromDay: 7, remodellingFromDay: 21 } as const;

/** Common practice: the acute phase lasts from a day to a week with severity; "no massage for 24–72 h". */
export const mildEarliestExitHours = 48;

export interface SuggestPhaseInput {
  injuredAt: Instant;
  now: Instant;
  grade: SeverityGrade | null | undefined;
  /** Girth rose by more than the clinic's threshold since the previous measurement. */
  swellingIncreased: boolean;
  override: PhaseOverride | null | undefined;
}

export interface PhaseSuggestion {
  suggestedPhase: Phase;
  /** The phase in force: the override when there is one, otherwise the suggestion. */
  phase: Phase;
  /** Plain-language reason for `phase`, for the therapist and the review desk. */
  reason: string;
  /** The reason for the suggestion alone, kept so an override can be compared with it. */
  suggestedReason: string;
  isOverride: boolean;
  daysSinceInjury: number;
}

export function suggestPhase(input: SuggestPhaseInput): PhaseSuggestion {
  const injured = toMillis(input.injuredAt, 'injuredAt');
  const now = toMillis(input.now, 'now');
  // An injury time a few minutes ahead of this device's clock (allowed by the records schema) is day 0.
  const elapsedMs = Math.max(0, now - injured);
  // Whole 24-hour periods, not calendar dates: an injury at 23:00 stays on day 0 until 23:00 the next day,
  // which needs no time zone and matches "days since injury" in the bands.
  const daysSinceInjury = Math.floor(elapsedMs / msPerDay);
  const dayWord = `Day ${daysSinceInjury} since injury`;

  let suggestedPhase: Phase;
  let suggestedReason: string;
  if (input.swellingIncreased) {
    // Common practice: when swelling increases the athlete goes back to cold and compression, whatever the date.
    suggestedPhase = 'acute';
    suggestedReason = `${dayWord}, but swelling has increased since the last measurement, so treat as acute (common practice: back to cold and compression).`;
  } else if (daysSinceInjury < phaseDayBands.proliferativeFromDay) {
    if (input.grade === 'mild' && elapsedMs >= mildEarliestExitHours * msPerHour) {
      suggestedPhase = 'proliferative';
      suggestedReason = `${dayWord}: a mild contusion with no increase in swelling may leave the acute phase after 48 hours (common practice), earlier than the day-7 band (Kannus 2000).`;
    } else {
      suggestedPhase = 'acute';
      suggestedReason = `${dayWord}: days 0 to 6 are the acute phase (Kannus 2000).`;
    }
  } else if (daysSinceInjury < phaseDayBands.remodellingFromDay) {
    suggestedPhase = 'proliferative';
    suggestedReason = `${dayWord}: days 7 to 20 are the proliferative phase (Kannus 2000).`;
  } else {
    suggestedPhase = 'remodelling';
    suggestedReason = `${dayWord}: from day 21 on is the remodelling phase (Kannus 2000).`;
  }

  if (input.override) {
    return {
      suggestedPhase,
      phase: input.override.phase,
      reason: `Set to ${input.override.phase} by the therapist: ${input.override.reason.trim().replace(/[.!?]+$/, '')}. Suggested from time and signs: ${suggestedPhase}.`,
      suggestedReason,
      isOverride: true,
      daysSinceInjury,
    };
  }
  return { suggestedPhase, phase: suggestedPhase, reason: suggestedReason, suggestedReason, isOverride: false, daysSinceInjury };
}
