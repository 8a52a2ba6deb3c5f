import type { Phase } from '../phase';
import { sources } from '../clinical/sources';
import { stepKindInfo, type StepKind } from './step-kinds';

/*
 * The treatment rules every path obeys: the sequence a clinic saves (shared/plan/sequence.ts and the
 * sequence service), the plan buildPlan returns (shared/plan/build-plan.ts) and the run the machine plays
 * (machines/treatment-run.ts). Pure: no clock, no storage. Decision record 0100 explains the choices.
 *
 * Cold is any step whose kind has `cold` (cold pack, ice massage).
 *  1. No continuous cold over 20 minutes, extensions included (common practice).
 *  2. A cold step never starts sooner than the clinic's minimum interval after the previous cold step ended
 *     (decisions.md: default 10 minutes), whatever lies between (a rest, a swelling check, nothing).
 *  3. Ice massage 300–420 s (common practice, the kind's bounds); no massage kinds while acute.
 *  4. No deep work (friction, broadening, stripping) after screening ticked suspected myositis ossificans,
 *     anticoagulants or a bleeding disorder, or open skin over the area.
 *  5. A red flag ends the run stopped-and-referred (shared/runs/screening.ts and the machine).
 */

/** Rule 1: the longest continuous cold, in seconds. */
export const maxContinuousColdSeconds = 1200;
export const maxContinuousColdSource = `no continuous cold over 20 minutes: ${sources.commonPractice}`;

/**
 * The shortest minimum interval a clinic may set (clinic settings: 1–60 minutes). A sequence is checked
 * against it when it is parsed anywhere, and against the clinic's own interval when it is saved.
 */
export const shortestMinColdIntervalSeconds = 60;

export const isCold = (kind: StepKind): boolean => stepKindInfo[kind].cold;
export const isMassage = (kind: StepKind): boolean => stepKindInfo[kind].massage;
export const isDeepWork = (kind: StepKind): boolean => stepKindInfo[kind].deepWork;

/** Rule 3: massage kinds are never part of the acute phase ("no massage for 24–72 h", common practice). */
export const isAllowedInPhase = (kind: StepKind, phase: Phase): boolean => phase !== 'acute' || !isMassage(kind);

export interface TimedStep {
  kind: StepKind;
  seconds: number;
}

export interface RuleIssue {
  index: number;
  field: 'kind' | 'seconds';
  message: string;
}

function minutesText(seconds: number): string {
  const minutes = Math.round((seconds / 60) * 10) / 10;
  return `${minutes} min`;
}

/** Rule 2 as planned: how long after the previous cold step each step starts, if played for its planned time. */
export function coldGapBefore(steps: readonly TimedStep[], index: number): number | null {
  let gap: number | null = null;
  for (let i = 0; i < index; i += 1) {
    if (isCold(steps[i].kind)) gap = 0;
    else if (gap !== null) gap += steps[i].seconds;
  }
  return gap;
}

export function coldTooSoonMessage(kind: StepKind, gapSeconds: number, minColdIntervalSeconds: number): string {
  const after = gapSeconds === 0 ? 'straight after the previous cold step' : `${minutesText(gapSeconds)} after the previous cold step ended`;
  return `${stepKindInfo[kind].label} would start ${after}; cold needs a break of at least ${minutesText(minColdIntervalSeconds)} (the clinic's minimum interval)`;
}

/**
 * Every rule a list of steps can break on its own: rules 2 and 3 here; rule 1 per step and rule 3's ice-massage
 * range are the kinds' bounds (shared/plan/step-kinds.ts), which every cold kind keeps within 20 minutes.
 * An empty list means the steps are safe.
 */
export function stepRuleIssues(phase: Phase, steps: readonly TimedStep[], minColdIntervalSeconds: number): RuleIssue[] {
  const issues: RuleIssue[] = [];
  steps.forEach((step, index) => {
    const label = stepKindInfo[step.kind].label;
    if (!isAllowedInPhase(step.kind, phase)) {
      issues.push({ index, field: 'kind', message: `${label} is massage and cannot be part of an acute sequence` });
    }
    if (isCold(step.kind)) {
      const gap = coldGapBefore(steps, index);
      if (gap !== null && gap < minColdIntervalSeconds) {
        issues.push({ index, field: 'kind', message: coldTooSoonMessage(step.kind, gap, minColdIntervalSeconds) });
      }
    }
  });
  return issues;
}

/** What screening decided about the plan: rule 4's deep-work reasons and the cold contraindication. */
export interface PlanRestrictions {
  coldContraindicated: boolean;
  /** Why deep work is out, one caution text each; empty when deep work is allowed. */
  deepWorkReasons: readonly string[];
}

/** Why a step is left out of a plan, in words for plan review and table mode; null when it stays. */
export function exclusionReason(kind: StepKind, phase: Phase, restrictions: PlanRestrictions): string | null {
  if (!isAllowedInPhase(kind, phase)) return 'massage is not part of the acute phase';
  if (restrictions.coldContraindicated && isCold(kind)) return 'cold is contraindicated';
  if (restrictions.deepWorkReasons.length > 0 && isDeepWork(kind)) return 'deep work is not allowed after the screening';
  return null;
}

/** Rule 1 in the run: a step may be extended up to its kind's bound, and cold never past 20 minutes. */
export function maxStepSeconds(kind: StepKind): number {
  const bound = stepKindInfo[kind].bounds.max;
  return isCold(kind) ? Math.min(bound, maxContinuousColdSeconds) : bound;
}

/**
 * Rule 2 in the run: how long a fresh cold step must wait at `now`, in ms. `currentIsCold` says a cold step
 * is on at this moment (it ends now); otherwise the wait counts from when the last cold step ended.
 */
export function coldWaitMs(args: { now: number; lastColdEndedAt: number | null; currentIsCold: boolean; minColdIntervalSeconds: number }): number {
  const intervalMs = args.minColdIntervalSeconds * 1000;
  if (args.currentIsCold) return intervalMs;
  if (args.lastColdEndedAt === null) return 0;
  return Math.max(0, args.lastColdEndedAt + intervalMs - args.now);
}
