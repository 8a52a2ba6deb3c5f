import { stepKindInfo } from '../plan/step-kinds';
import type { LogEntryType, RunStatus } from '../runs/log-entry';

/**
 * What makes a finished run need a supervisor's look. The same rules feed the row flags, the "needs
 * attention" filter (server/services/review-service.ts mirrors them in SQL, backed by a partial index in
 * migrations/20261202000500) and the adherence figures, so a flag and a figure never disagree.
 */

export const attentionFlags = ['fell-back', 'red-flag', 'skipped-steps', 'ice-massage-out-of-bounds', 'abandoned', 'ended-early'] as const;
export type AttentionFlag = (typeof attentionFlags)[number];
/** The client's name for the same list. */
export const attentionKinds = attentionFlags;
export type AttentionKind = AttentionFlag;

/** Ice massage 5–7 minutes at a time (common practice), read from the step kind's safety bounds. */
export const iceMassageBounds = stepKindInfo['ice-massage'].bounds;

/** The log entries that close a step, one per step reached. */
export const stepResultTypes = ['step-completed', 'step-skipped', 'step-interrupted'] as const satisfies readonly LogEntryType[];

/** Table mode writes this detail on a skip of a step the sequence marks optional. */
export const optionalSkipDetail = 'optional step';

export interface StepEntryLike {
  type: LogEntryType | string;
  kind: string | null;
  stepIndex?: number | null;
  actualSeconds: number | null;
  detail?: string | null;
}

/**
 * A skip of an optional step follows the sequence (the optional ice massage after deep work is skipped when
 * the area is not sore), so only a skipped required step counts as a departure from the protocol.
 */
export function isRequiredSkip(entry: StepEntryLike): boolean {
  return entry.type === 'step-skipped' && entry.detail !== optionalSkipDetail;
}

/** A completed ice-massage step; interrupted ones stopped for a reason the run's outcome already shows. */
export function isCompletedIceMassage(entry: StepEntryLike): boolean {
  return entry.type === 'step-completed' && entry.kind === 'ice-massage' && entry.actualSeconds !== null;
}

export function isIceMassageWithinBounds(seconds: number): boolean {
  return seconds >= iceMassageBounds.min && seconds <= iceMassageBounds.max;
}

export function isIceMassageOutOfBounds(entry: StepEntryLike): boolean {
  return isCompletedIceMassage(entry) && !isIceMassageWithinBounds(entry.actualSeconds as number);
}

const statusFlags: Partial<Record<RunStatus, AttentionFlag>> = {
  'fell-back': 'fell-back',
  'stopped-referred': 'red-flag',
  abandoned: 'abandoned',
  'ended-early': 'ended-early',
};

/** Statuses that need attention by themselves, whatever the log says. */
export const attentionStatuses = Object.keys(statusFlags) as RunStatus[];

/** The flags of one run, in the fixed order of `attentionFlags`. */
export function runAttention(status: RunStatus, entries: readonly StepEntryLike[]): AttentionFlag[] {
  const found = new Set<AttentionFlag>();
  const fromStatus = statusFlags[status];
  if (fromStatus) found.add(fromStatus);
  if (entries.some((entry) => entry.type === 'red-flag')) found.add('red-flag');
  if (entries.some(isRequiredSkip)) found.add('skipped-steps');
  if (entries.some(isIceMassageOutOfBounds)) found.add('ice-massage-out-of-bounds');
  return attentionFlags.filter((flag) => found.has(flag));
}
