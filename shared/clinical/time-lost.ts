import type { SeverityGrade } from './severity';
import { sources } from './sources';

/** Mean days of disability by grade among West Point cadets (Ryan et al. 1991). */
export const ryanMeanDaysLost: Record<SeverityGrade, number> = { mild: 13, moderate: 19, severe: 21 };

export interface PublishedTimeLost {
  grade: SeverityGrade;
  meanDays: number;
  /** Ready to show: says plainly that this is a group average, not this athlete's outlook. */
  wording: string;
  source: string;
}

/**
 * The published mean for the grade. It is worded as a group figure because athletes, treatments and
 * sports differ from the study's cadets, and a therapist quoting it as "you'll be back in 13 days" would
 * be promising something the study never measured.
 */
export function publishedTimeLost(grade: SeverityGrade | null | undefined): PublishedTimeLost | null {
  if (!grade) return null;
  const meanDays = ryanMeanDaysLost[grade];
  return {
    grade,
    meanDays,
    wording:
      `Published mean for a ${grade} thigh contusion: ${meanDays} days of disability (West Point cadets, Ryan et al. 1991). ` +
      'This is a group average, not a prediction for this athlete.',
    source: sources.ryan1991,
  };
}
