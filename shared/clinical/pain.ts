import { toMillis, type Instant } from './instant';
import { sources } from './sources';

/** Farrar et al. 2001: a change of about 2 points or about 30 % on the 0–10 NPRS was clinically important. */
export const importantPainChange = { points: 2, percent: 30 } as const;

export interface PainChange {
  previous: number;
  latest: number;
  /** latest − previous, NPRS points: negative is less pain. */
  change: number;
  /** Relative to the previous score, %, to 0.1; null when the previous score was 0. */
  percentChange: number | null;
  clinicallyImportant: boolean;
  direction: 'better' | 'worse' | 'unchanged';
  note: string;
  source: string;
}

/**
 * Either threshold is enough, as Farrar et al. reported both. They measured reductions in chronic pain; the
 * same thresholds are applied to a rise as well, and to an acute injury, which the note says wherever the
 * result is shown.
 */
export function painChange(previous: number, latest: number): PainChange {
  const change = latest - previous;
  // Rounded so that 10 → 7 is exactly −30 %, not −30.000000000000004 %.
  const percentChange = previous === 0 ? null : Math.round((change / previous) * 1000) / 10;
  const clinicallyImportant =
    Math.abs(change) >= importantPainChange.points ||
    (percentChange !== null && Math.abs(percentChange) >= importantPainChange.percent);
  return {
    previous,
    latest,
    change,
    percentChange,
    clinicallyImportant,
    direction: change < 0 ? 'better' : change > 0 ? 'worse' : 'unchanged',
    note: 'Thresholds measured in chronic pain (Farrar et al. 2001); applied here to an acute injury.',
    source: sources.farrar2001,
  };
}

export interface PainMeasurement {
  takenAt: Instant;
  painNprs?: number | null;
}

/** Change between the two most recent pain scores, whatever order the measurements arrive in. */
export function latestPainChange(measurements: readonly PainMeasurement[]): PainChange | null {
  const scored = measurements
    .filter((m): m is PainMeasurement & { painNprs: number } => typeof m.painNprs === 'number')
    .map((m) => ({ ms: toMillis(m.takenAt, 'takenAt'), score: m.painNprs }))
    .sort((a, b) => a.ms - b.ms);
  if (scored.length < 2) return null;
  return painChange(scored[scored.length - 2].score, scored[scored.length - 1].score);
}
