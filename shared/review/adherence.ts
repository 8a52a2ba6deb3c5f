import { phases, type Phase } from '../phase';
import type { RunStatus } from '../runs/log-entry';
import { isCompletedIceMassage, isIceMassageWithinBounds, isRequiredSkip, stepResultTypes, type StepEntryLike } from './attention';

/**
 * Adherence to the clinic's protocol over a set of finished runs: how often ice massage stayed within
 * 5–7 minutes (common practice), how often swelling forced a fall back, how many required steps were
 * skipped, and how the runs spread over the phases.
 */

export interface AdherenceFigures {
  runs: number;
  /** Completed ice-massage steps, whatever their length. */
  iceMassageSteps: number;
  iceMassageWithinBounds: number;
  /** 0..1; null when no ice massage was completed, because "none of none" is not 0 %. */
  iceMassageShare: number | null;
  /** Runs that fell back (swelling increased), including "stop, elevate, refer" where cold was not allowed. */
  fallbacks: number;
  /** fallbacks / runs; 0 when there are no runs. */
  fallbackRate: number;
  /** Required plan steps skipped; skipping an optional step follows the sequence and is not counted. */
  skippedSteps: number;
  /** Plan steps reached (completed, skipped or interrupted). */
  totalSteps: number;
  /** skippedSteps / totalSteps; 0 when no step was reached. */
  skippedRate: number;
  runsPerPhase: Record<Phase, number>;
}

export interface TherapistAdherence extends AdherenceFigures {
  therapistId: string;
  name: string;
}

export interface AdherenceReport {
  from: string;
  to: string;
  clinic: AdherenceFigures;
  therapists: TherapistAdherence[];
}

export interface AdherenceRun {
  therapistId: string;
  phase: Phase;
  status: RunStatus;
  /** The run's log entries; only step results are read. */
  entries: readonly StepEntryLike[];
}

const ratio = (part: number, whole: number) => (whole === 0 ? 0 : part / whole);

export function adherenceFigures(runs: readonly AdherenceRun[]): AdherenceFigures {
  const runsPerPhase = Object.fromEntries(phases.map((phase) => [phase, 0])) as Record<Phase, number>;
  let iceMassageSteps = 0;
  let iceMassageWithinBounds = 0;
  let fallbacks = 0;
  let skippedSteps = 0;
  let totalSteps = 0;

  for (const run of runs) {
    runsPerPhase[run.phase] += 1;
    if (run.status === 'fell-back') fallbacks += 1;
    for (const entry of run.entries) {
      if (!(stepResultTypes as readonly string[]).includes(entry.type)) continue;
      if (isCompletedIceMassage(entry)) {
        iceMassageSteps += 1;
        if (isIceMassageWithinBounds(entry.actualSeconds as number)) iceMassageWithinBounds += 1;
      }
      // Back to cold's steps have no plan index: they are the fall back itself, not steps of the plan.
      if (entry.stepIndex === null || entry.stepIndex === undefined) continue;
      totalSteps += 1;
      if (isRequiredSkip(entry)) skippedSteps += 1;
    }
  }

  return {
    runs: runs.length,
    iceMassageSteps,
    iceMassageWithinBounds,
    iceMassageShare: iceMassageSteps === 0 ? null : iceMassageWithinBounds / iceMassageSteps,
    fallbacks,
    fallbackRate: ratio(fallbacks, runs.length),
    skippedSteps,
    totalSteps,
    skippedRate: ratio(skippedSteps, totalSteps),
    runsPerPhase,
  };
}

/** The clinic's figures and each therapist's, therapists in name order. */
export function adherenceReport(
  runs: readonly AdherenceRun[],
  therapistNames: ReadonlyMap<string, string>,
  range: { from: string; to: string },
): AdherenceReport {
  const byTherapist = new Map<string, AdherenceRun[]>();
  for (const run of runs) {
    const own = byTherapist.get(run.therapistId);
    if (own) own.push(run);
    else byTherapist.set(run.therapistId, [run]);
  }
  const therapists = [...byTherapist.entries()]
    .map(([therapistId, own]) => ({ therapistId, name: therapistNames.get(therapistId) ?? 'Unknown staff member', ...adherenceFigures(own) }))
    .sort((a, b) => a.name.localeCompare(b.name) || a.therapistId.localeCompare(b.therapistId));
  return { from: range.from, to: range.to, clinic: adherenceFigures(runs), therapists };
}
