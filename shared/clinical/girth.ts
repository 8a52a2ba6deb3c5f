import { toMillis, type Instant } from './instant';
import { sources } from './sources';

export interface GirthMeasurement {
  takenAt: Instant;
  girthInjuredCm?: number | null;
  girthOtherCm?: number | null;
  girthLandmark?: string | null;
  girthDistanceCm?: number | null;
}

export interface GirthReading {
  takenAt: string;
  injuredCm: number;
  otherCm: number;
  /** Injured minus other side, cm: positive when the injured limb is larger. */
  differenceCm: number;
  landmark: string | null;
  distanceCm: number | null;
}

export interface GirthSummary {
  latest: GirthReading | null;
  previous: GirthReading | null;
  /** Change in the side-to-side difference since the previous girth; null when there is none to compare. */
  changeDifferenceCm: number | null;
  /** Change in the injured side alone, shown beside the difference for the therapist. */
  changeInjuredCm: number | null;
  swellingIncreased: boolean;
  thresholdCm: number;
  thresholdSource: string;
  /** Why no change could be computed, when that is the case. */
  note: string | null;
}

/** Tape measures read to a millimetre; rounding here stops 46.1 − 45.1 = 1.0000000000000014 crossing a 1 cm threshold. */
function roundToMillimetre(cm: number): number {
  return Math.round(cm * 10) / 10;
}

export function girthDifferenceCm(m: GirthMeasurement): number | null {
  if (!isNumber(m.girthInjuredCm) || !isNumber(m.girthOtherCm)) return null;
  return roundToMillimetre(m.girthInjuredCm - m.girthOtherCm);
}

/**
 * Latest girth, its change since the previous girth, and whether swelling increased: the side-to-side
 * difference grew by more than the clinic's threshold. The difference, not the injured side alone, is the
 * measure because the uninjured limb measured at the same time absorbs changes that are not swelling (time
 * of day, hydration, a training session). The threshold is the clinic's setting; no published minimal
 * detectable change for limb girth was found. Readings from different sites are not compared.
 */
export function summariseGirth(measurements: readonly GirthMeasurement[], thresholdCm: number): GirthSummary {
  const readings = measurements
    .filter((m) => isNumber(m.girthInjuredCm) && isNumber(m.girthOtherCm))
    .map((m) => ({ ms: toMillis(m.takenAt, 'takenAt'), m }))
    .sort((a, b) => a.ms - b.ms)
    .map(({ ms, m }) => toReading(ms, m));

  const latest = readings.at(-1) ?? null;
  const previous = readings.at(-2) ?? null;
  const base = { latest, previous, thresholdCm, thresholdSource: sources.clinicSetting };

  if (!latest || !previous) {
    return { ...base, changeDifferenceCm: null, changeInjuredCm: null, swellingIncreased: false, note: latest ? 'Only one girth recorded so far.' : null };
  }
  if (!sameSite(latest, previous)) {
    return {
      ...base,
      changeDifferenceCm: null,
      changeInjuredCm: null,
      swellingIncreased: false,
      note: 'The last two girths were taken at different sites, so they are not compared. Measure at the same landmark and distance.',
    };
  }
  const changeDifferenceCm = roundToMillimetre(latest.differenceCm - previous.differenceCm);
  return {
    ...base,
    changeDifferenceCm,
    changeInjuredCm: roundToMillimetre(latest.injuredCm - previous.injuredCm),
    swellingIncreased: changeDifferenceCm > thresholdCm,
    note: null,
  };
}

function toReading(ms: number, m: GirthMeasurement): GirthReading {
  const injuredCm = m.girthInjuredCm as number;
  const otherCm = m.girthOtherCm as number;
  return {
    takenAt: new Date(ms).toISOString(),
    injuredCm,
    otherCm,
    differenceCm: roundToMillimetre(injuredCm - otherCm),
    landmark: m.girthLandmark?.trim() || null,
    distanceCm: isNumber(m.girthDistanceCm) ? m.girthDistanceCm : null,
  };
}

function sameSite(a: GirthReading, b: GirthReading): boolean {
  const normalise = (landmark: string | null) => (landmark ?? '').toLowerCase().replace(/\s+/g, ' ');
  const sameDistance =
    a.distanceCm === null || b.distanceCm === null ? a.distanceCm === b.distanceCm : Math.abs(a.distanceCm - b.distanceCm) < 0.05;
  return normalise(a.landmark) === normalise(b.landmark) && sameDistance;
}

function isNumber(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}
