import type { ClinicSettings } from '../clinic/settings';
import type { Phase } from '../phase';
import type { BodyRegionId } from '../records/body-map';
import type { PhaseOverride } from '../records/injury';
import { summariseGirth, type GirthSummary } from './girth';
import { hoursBetween, toMillis, type Instant } from './instant';
import { assessMyositisRisk, type MyositisRisk } from './myositis-risk';
import { padSize, type PadSize } from './pad-size';
import { latestPainChange, type PainChange } from './pain';
import { suggestPhase } from './phase';
import { gradeThighContusion, type ThighContusionGrade } from './severity';
import { publishedTimeLost, type PublishedTimeLost } from './time-lost';

/** The injury fields the assessment reads; a database row or an API response both fit. */
export interface InjuryForAssessment {
  region: BodyRegionId;
  injuredAt: Instant;
  previousQuadricepsInjury: boolean;
  kneeEffusion: boolean;
  treatmentStartedAt?: Instant | null;
  phaseOverride?: PhaseOverride | null;
}

export interface MeasurementForAssessment {
  takenAt: Instant;
  girthInjuredCm?: number | null;
  girthOtherCm?: number | null;
  girthLandmark?: string | null;
  girthDistanceCm?: number | null;
  kneeFlexionDeg?: number | null;
  painNprs?: number | null;
  bruiseLengthCm?: number | null;
  bruiseWidthCm?: number | null;
}

export interface AssessInjuryInput {
  injury: InjuryForAssessment;
  athleteSport: string | null | undefined;
  measurements: readonly MeasurementForAssessment[];
  settings: Pick<ClinicSettings, 'swellingThresholdCm'>;
  now: Instant;
}

export interface InjuryAssessment {
  daysSinceInjury: number;
  severity: ThighContusionGrade | null;
  timeLost: PublishedTimeLost | null;
  suggestedPhase: Phase;
  phase: Phase;
  phaseReason: string;
  suggestedPhaseReason: string;
  phaseIsOverride: boolean;
  risks: MyositisRisk;
  girth: GirthSummary;
  pain: PainChange | null;
  padSize: PadSize | null;
}

/** Everything the API attaches to an injury, computed from the records alone and the given `now`. */
export function assessInjury(input: AssessInjuryInput): InjuryAssessment {
  const { injury, measurements, now } = input;
  const byTime = measurements
    .map((m) => ({ ms: toMillis(m.takenAt, 'takenAt'), m }))
    .sort((a, b) => a.ms - b.ms)
    .map(({ m }) => m);

  // The latest flexion is graded, because it is the athlete's current state; the timing warning then tells
  // the therapist whether that reading falls inside the published 12–48 h window.
  const flexionReadings = byTime.filter((m): m is MeasurementForAssessment & { kneeFlexionDeg: number } =>
    typeof m.kneeFlexionDeg === 'number',
  );
  const graded = flexionReadings.at(-1);
  const severity = graded
    ? gradeThighContusion({
        region: injury.region,
        kneeFlexionDeg: graded.kneeFlexionDeg,
        hoursSinceInjury: hoursBetween(injury.injuredAt, graded.takenAt),
      })
    : null;

  const girth = summariseGirth(byTime, input.settings.swellingThresholdCm);
  const phase = suggestPhase({
    injuredAt: injury.injuredAt,
    now,
    grade: severity?.grade ?? null,
    swellingIncreased: girth.swellingIncreased,
    override: injury.phaseOverride ?? null,
  });

  // Without a recorded start, the first measurement is the earliest evidence that treatment had begun.
  const treatmentStartedAt = injury.treatmentStartedAt ?? byTime[0]?.takenAt ?? null;
  const risks = assessMyositisRisk({
    region: injury.region,
    kneeFlexionDegs: flexionReadings.map((m) => m.kneeFlexionDeg),
    previousQuadricepsInjury: injury.previousQuadricepsInjury,
    kneeEffusion: injury.kneeEffusion,
    sport: input.athleteSport,
    injuredAt: injury.injuredAt,
    treatmentStartedAt,
    now,
  });

  const latestBruise = byTime.filter((m) => typeof m.bruiseLengthCm === 'number' && typeof m.bruiseWidthCm === 'number').at(-1);

  return {
    daysSinceInjury: phase.daysSinceInjury,
    severity,
    timeLost: publishedTimeLost(severity?.grade),
    suggestedPhase: phase.suggestedPhase,
    phase: phase.phase,
    phaseReason: phase.reason,
    suggestedPhaseReason: phase.suggestedReason,
    phaseIsOverride: phase.isOverride,
    risks,
    girth,
    pain: latestPainChange(byTime),
    padSize: latestBruise ? padSize(latestBruise) : null,
  };
}
