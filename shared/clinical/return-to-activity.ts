import { isAnteriorThighRegion, type BodyRegionId } from '../records/body-map';
import { girthDifferenceCm } from './girth';
import { toMillis, type Instant } from './instant';
import { sources } from './sources';

/**
 * The return-to-activity check shown before an injury is closed. Every criterion is read from the LATEST
 * measurement alone: an older reading says how the athlete was, not how they are now, so a value missing
 * from the latest measurement counts as "not measured" rather than being borrowed from an earlier one
 * (docs/decisions/0071-return-to-activity-from-the-latest-measurement.md).
 */

export const aronenChronister1992 = 'Aronen JG, Chronister RD. Phys Sportsmed 1992;20(7):130–136 (title not retrieved)';

/** Active knee flexion needed to return after a quadriceps contusion (Aronen & Chronister 1992). */
export const returnKneeFlexionDeg = 120;

/** Functional tests the therapist performs and ticks; common practice, for every site. */
export const functionalTests = [
  { id: 'full-active-range', label: 'Full active range of motion without pain, equal to the other side' },
  { id: 'resisted-contraction', label: 'Resisted contraction at full effort without pain' },
  { id: 'sport-specific-drills', label: 'Sport-specific drills at full speed without pain, limping or guarding' },
] as const;
export type FunctionalTestId = (typeof functionalTests)[number]['id'];
export const functionalTestIds = functionalTests.map((t) => t.id) as [FunctionalTestId, ...FunctionalTestId[]];

export type CriterionStatus = 'met' | 'unmet' | 'not-measured';

export interface CriterionResult {
  id: string;
  label: string;
  status: CriterionStatus;
  /** What the latest measurement says, in words; null when it says nothing. */
  value: string | null;
  target: string;
  source: string;
}

export interface RtaMeasurement {
  id?: string;
  takenAt: Instant;
  kneeFlexionDeg?: number | null;
  girthInjuredCm?: number | null;
  girthOtherCm?: number | null;
  painNprs?: number | null;
}

export interface ReturnToActivityInput {
  region: BodyRegionId;
  measurements: readonly RtaMeasurement[];
  /** The clinic's girth threshold, cm (its "swelling has increased" setting). */
  girthThresholdCm: number;
  /** The functional tests the therapist has ticked as passed. */
  passedTests: readonly string[];
}

export interface ReturnToActivityCheck {
  criteria: CriterionResult[];
  allMet: boolean;
  /** The measurement the criteria were read from. */
  measurement: { id: string | null; takenAt: string } | null;
  unmet: CriterionResult[];
}

const isNumber = (value: number | null | undefined): value is number => typeof value === 'number' && Number.isFinite(value);

export function latestMeasurement<M extends RtaMeasurement>(measurements: readonly M[]): M | null {
  let latest: M | null = null;
  let latestMs = -Infinity;
  for (const m of measurements) {
    const ms = toMillis(m.takenAt, 'takenAt');
    // Ties keep the later entry in the list: it was recorded after the other one.
    if (ms >= latestMs) {
      latest = m;
      latestMs = ms;
    }
  }
  return latest;
}

export function returnToActivityCheck(input: ReturnToActivityInput): ReturnToActivityCheck {
  const latest = latestMeasurement(input.measurements);
  const criteria: CriterionResult[] = [];

  if (isAnteriorThighRegion(input.region)) {
    const flexion = latest?.kneeFlexionDeg;
    criteria.push({
      id: 'knee-flexion',
      label: `Active knee flexion of at least ${returnKneeFlexionDeg}°`,
      status: !isNumber(flexion) ? 'not-measured' : flexion >= returnKneeFlexionDeg ? 'met' : 'unmet',
      value: isNumber(flexion) ? `${flexion}°` : null,
      target: `≥ ${returnKneeFlexionDeg}°`,
      source: `${aronenChronister1992}: return criterion of ${returnKneeFlexionDeg}° knee flexion`,
    });
    const difference = latest ? girthDifferenceCm(latest) : null;
    criteria.push({
      id: 'girth-difference',
      label: `Girth difference between the sides within ${input.girthThresholdCm} cm`,
      status: difference === null ? 'not-measured' : Math.abs(difference) <= input.girthThresholdCm ? 'met' : 'unmet',
      value: difference === null ? null : `${difference > 0 ? '+' : ''}${difference.toFixed(1)} cm`,
      target: `within ±${input.girthThresholdCm} cm`,
      source: sources.clinicSetting,
    });
  }

  const pain = latest?.painNprs;
  criteria.push({
    id: 'pain-at-rest',
    label: 'Pain at rest 0 on the NPRS',
    status: !isNumber(pain) ? 'not-measured' : pain === 0 ? 'met' : 'unmet',
    value: isNumber(pain) ? `${pain} of 10` : null,
    target: '0 of 10',
    source: sources.commonPractice,
  });

  const passed = new Set(input.passedTests);
  for (const test of functionalTests) {
    criteria.push({
      id: `functional:${test.id}`,
      label: test.label,
      status: passed.has(test.id) ? 'met' : 'unmet',
      value: passed.has(test.id) ? 'passed' : null,
      target: 'passed, as judged by the therapist',
      source: sources.commonPractice,
    });
  }

  const unmet = criteria.filter((c) => c.status !== 'met');
  return {
    criteria,
    allMet: unmet.length === 0,
    measurement: latest ? { id: latest.id ?? null, takenAt: new Date(toMillis(latest.takenAt, 'takenAt')).toISOString() } : null,
    unmet,
  };
}
