import { finishedStatuses, type RunView } from '../../../../shared/runs/responses';

/**
 * Where table mode starts a run from. The server's record is the truth and the tablet's stored snapshot a
 * cache: a run the server has finished is never run again, whatever the tablet holds, and a snapshot that
 * knows fewer entries than the server's log (another tablet, or this one before a restore from backup, went
 * further) is replaced by a rebuild from that log.
 */
export type StartingPoint<S> =
  | { kind: 'finished' }
  | { kind: 'restore'; snapshot: S }
  | { kind: 'rebuild' }
  | { kind: 'new' };

type StoredSnapshot = { context?: { logSeq?: number } };

export function chooseStartingPoint<S extends StoredSnapshot>(
  run: Pick<RunView, 'status'>,
  stored: S | undefined,
  serverEntries: readonly { seq: number | null }[],
): StartingPoint<S> {
  if (finishedStatuses.includes(run.status)) return { kind: 'finished' };
  // Entries without a seq were logged before seq existed; counting them keeps the comparison conservative.
  const serverKnows = serverEntries.reduce((most, entry, index) => Math.max(most, entry.seq ?? index + 1), 0);
  if (stored) {
    const storedKnows = stored.context?.logSeq ?? 0;
    if (storedKnows >= serverKnows) return { kind: 'restore', snapshot: stored };
  }
  return serverEntries.length ? { kind: 'rebuild' } : { kind: 'new' };
}
