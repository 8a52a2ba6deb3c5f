import { isAnteriorThighRegion, type BodyRegionId } from '../records/body-map';
import { sources } from './sources';

export const severityGrades = ['mild', 'moderate', 'severe'] as const;
export type SeverityGrade = (typeof severityGrades)[number];

/**
 * The published grading was done on measurements taken 12–24 h after injury (Ryan et al. 1991) and
 * 24–48 h after injury (Jackson & Feagin 1973); outside that span the grade is shown with a warning.
 */
export const gradingWindowHours = { from: 12, to: 48 } as const;

export interface ThighContusionGrade {
  grade: SeverityGrade;
  kneeFlexionDeg: number;
  source: string;
  timingWarning?: string;
}

export interface GradeThighContusionInput {
  region: BodyRegionId;
  kneeFlexionDeg: number | null | undefined;
  /** Hours from injury to the knee-flexion measurement; omitted when not known. */
  hoursSinceInjury?: number | null;
}

/**
 * Severity of an anterior-thigh (quadriceps) contusion from active knee flexion (Ryan et al. 1991:
 * mild > 90°, moderate 45°–90°, severe < 45°). The abstract does not say where exactly 90° and 45° fall;
 * Mendstep counts both as moderate (45–90 inclusive), the literal reading of the strict "> 90°" and "< 45°"
 * of the other two bands. Other regions have no published knee-flexion grading, so they get null, not a
 * guess.
 */
export function gradeThighContusion(input: GradeThighContusionInput): ThighContusionGrade | null {
  const { region, kneeFlexionDeg, hoursSinceInjury } = input;
  if (!isAnteriorThighRegion(region)) return null;
  if (kneeFlexionDeg === null || kneeFlexionDeg === undefined || Number.isNaN(kneeFlexionDeg)) return null;

  const grade: SeverityGrade = kneeFlexionDeg > 90 ? 'mild' : kneeFlexionDeg >= 45 ? 'moderate' : 'severe';
  const result: ThighContusionGrade = {
    grade,
    kneeFlexionDeg,
    source: `${sources.ryan1991}: mild > 90°, moderate 45°–90°, severe < 45° of active knee flexion`,
  };

  const timingWarning = gradingTimingWarning(hoursSinceInjury);
  if (timingWarning) result.timingWarning = timingWarning;
  return result;
}

function gradingTimingWarning(hoursSinceInjury: number | null | undefined): string | undefined {
  if (hoursSinceInjury === null || hoursSinceInjury === undefined || Number.isNaN(hoursSinceInjury)) return undefined;
  const { from, to } = gradingWindowHours;
  if (hoursSinceInjury >= from && hoursSinceInjury <= to) return undefined;
  const when = hoursSinceInjury < 0 ? 'before the recorded injury time' : `${formatHours(hoursSinceInjury)} after injury`;
  return (
    `Knee flexion was measured ${when}. The published grading used measurements taken ${from}–${to} h after ` +
    'injury (12–24 h in Ryan et al. 1991; 24–48 h in Jackson & Feagin 1973), so treat this grade as approximate' +
    (hoursSinceInjury < from ? ' and measure again once 12 hours have passed.' : '.')
  );
}

function formatHours(hours: number): string {
  return hours < 10 ? `${Math.round(hours * 10) / 10} h` : `${Math.round(hours)} h`;
}
