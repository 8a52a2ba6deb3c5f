import { isThighRegion, type BodyRegionId } from '../records/body-map';
import { msPerDay, toMillis, type Instant } from './instant';
import { sources } from './sources';

export const myositisRiskFactorIds = [
  'knee-flexion-below-120',
  'football',
  'previous-quadriceps-injury',
  'treatment-delayed',
  'knee-effusion',
] as const;
export type MyositisRiskFactorId = (typeof myositisRiskFactorIds)[number];

export interface MyositisRiskFactor {
  id: MyositisRiskFactorId;
  label: string;
}

export interface MyositisCaution {
  lines: string[];
  source: string;
}

export interface MyositisRisk {
  /** False for regions outside the thigh: the published factors say nothing about them. */
  applies: boolean;
  factors: MyositisRiskFactor[];
  /** Present when at least one factor is. */
  caution: MyositisCaution | null;
  source: string;
  note: string;
}

export interface MyositisRiskInput {
  region: BodyRegionId;
  /** Every knee-flexion value recorded for the injury; the lowest one counts. */
  kneeFlexionDegs: readonly number[];
  previousQuadricepsInjury: boolean;
  kneeEffusion: boolean;
  sport: string | null | undefined;
  injuredAt: Instant;
  /** When treatment began; unknown when null. */
  treatmentStartedAt: Instant | null | undefined;
  now: Instant;
}

export const kneeFlexionRiskThresholdDeg = 120;
export const treatmentDelayThresholdDays = 3;

/*
 * Ryan et al.'s "injury in football" came from West Point cadets, whose football was American football.
 * Mendstep reads the factor as "a football code": any sport text containing football (American, Gaelic,
 * Australian rules...), soccer, gridiron or rugby (rugby football) counts. Widening it only adds a caution,
 * never removes one, so the broader reading is the safer one.
 */
const footballWords = /\b(football|soccer|gridiron|rugby|footy)\b/i;

export function isFootballCode(sport: string | null | undefined): boolean {
  return typeof sport === 'string' && footballWords.test(sport);
}

export const myositisCautionLines = [
  'Avoid deep work over the site: no friction, broadening or stripping there.',
  'Watch for local warmth, firmness or swelling that does not settle.',
  'If myositis ossificans is suspected, refer for imaging; X-rays are usually negative until 2–4 weeks.',
] as const;

/**
 * Risk factors for myositis ossificans after a thigh contusion (Ryan et al. 1991: knee flexion < 120°,
 * injury in football, previous quadriceps injury, treatment delayed > 3 days, knee effusion). Ryan studied
 * quadriceps contusions; Mendstep applies the factors to every thigh region of the body map (anterior,
 * lateral, posterior), as decisions.md groups them, because a missed caution costs more than an unneeded
 * one.
 */
export function assessMyositisRisk(input: MyositisRiskInput): MyositisRisk {
  const note =
    'Factors from quadriceps contusions (Ryan et al. 1991), applied by Mendstep to all thigh regions. ' +
    'Myositis ossificans followed 9 % of the contusions in that series.';
  if (!isThighRegion(input.region)) {
    return { applies: false, factors: [], caution: null, source: sources.ryan1991, note };
  }

  const factors: MyositisRiskFactor[] = [];
  // The lowest reading counts: once flexion has been below 120° the published risk was already present,
  // and later recovery of range does not undo it.
  const lowestFlexion = input.kneeFlexionDegs.length > 0 ? Math.min(...input.kneeFlexionDegs) : null;
  if (lowestFlexion !== null && lowestFlexion < kneeFlexionRiskThresholdDeg) {
    factors.push({ id: 'knee-flexion-below-120', label: `Knee flexion below 120° (lowest recorded ${lowestFlexion}°)` });
  }
  if (isFootballCode(input.sport)) {
    factors.push({ id: 'football', label: `Injury in football (${input.sport?.trim()})` });
  }
  if (input.previousQuadricepsInjury) {
    factors.push({ id: 'previous-quadriceps-injury', label: 'Previous quadriceps injury' });
  }
  if (isTreatmentDelayed(input.injuredAt, input.treatmentStartedAt, input.now)) {
    factors.push({ id: 'treatment-delayed', label: 'Treatment started more than 3 days after injury' });
  }
  if (input.kneeEffusion) {
    factors.push({ id: 'knee-effusion', label: 'Knee effusion' });
  }

  const caution: MyositisCaution | null =
    factors.length > 0 ? { lines: [...myositisCautionLines], source: sources.myositisPhysSportsmed1995 } : null;
  return { applies: true, factors, caution, source: sources.ryan1991, note };
}

/**
 * "Delayed" is strictly more than 3 × 24 h. With no start recorded, treatment counts as delayed once more
 * than 3 days have passed, since nothing shows it began in time.
 */
export function isTreatmentDelayed(injuredAt: Instant, treatmentStartedAt: Instant | null | undefined, now: Instant): boolean {
  const injured = toMillis(injuredAt, 'injuredAt');
  const started = treatmentStartedAt ? toMillis(treatmentStartedAt, 'treatmentStartedAt') : toMillis(now, 'now');
  return started - injured > treatmentDelayThresholdDays * msPerDay;
}
