import { DateTime } from 'luxon';
import { z } from 'zod';
import type { Phase } from '../phase';
import type { RecheckIntervals } from './settings';

/**
 * The next re-check of an open injury: Mendstep suggests one when a run ends (the clinic's interval for the
 * injury's phase after the run's end), and the therapist may move it. Today lists due and overdue ones first.
 */

export function suggestRecheckAt(phase: Phase, runEndedAt: Date, intervals: RecheckIntervals): Date {
  return new Date(runEndedAt.getTime() + intervals[phase] * 3_600_000);
}

/** overdue: the time has passed; due: later today in the clinic's zone; later; none: no re-check set. */
export const recheckStatuses = ['overdue', 'due', 'later', 'none'] as const;
export type RecheckStatus = (typeof recheckStatuses)[number];

export function recheckStatus(nextRecheckAt: Date | string | null, now: Date, timeZone: string): RecheckStatus {
  if (nextRecheckAt === null) return 'none';
  const at = typeof nextRecheckAt === 'string' ? new Date(nextRecheckAt) : nextRecheckAt;
  if (at.getTime() <= now.getTime()) return 'overdue';
  const endOfToday = DateTime.fromJSDate(now).setZone(timeZone).endOf('day');
  return at.getTime() <= endOfToday.toMillis() ? 'due' : 'later';
}

/** Today's order: overdue first (longest overdue on top), then due today (soonest first), then the rest as they came. */
export function recheckRank(status: RecheckStatus): number {
  return { overdue: 0, due: 1, later: 2, none: 2 }[status];
}

// A year ahead is as far as a re-check is ever booked; a typo in the year lands outside it.
const maxAheadMs = 366 * 24 * 3_600_000;
// A re-check saved a few minutes "in the past" is a clock difference between tablet and server, not an error.
const clockSlackMs = 5 * 60_000;

/** PUT /api/injuries/:id/recheck: a new time, or null to clear it. */
export const recheckBodySchema = z.object({
  nextRecheckAt: z
    .iso.datetime({ offset: true, error: 'Next re-check must be a date and time with its time zone (ISO 8601)' })
    .refine((value) => Date.parse(value) > Date.now() - clockSlackMs, { error: 'Next re-check must be in the future' })
    .refine((value) => Date.parse(value) < Date.now() + maxAheadMs, { error: 'Next re-check must be within a year' })
    .nullable()
    .describe("When the athlete should next be seen; null clears it"),
});
export type RecheckBody = z.infer<typeof recheckBodySchema>;

/**
 * Today's list: overdue re-checks first (longest overdue on top), then those due later today (soonest first),
 * then every other injury in the order it came (newest injury first). Stable, so equal ranks keep that order.
 */
export function orderForToday<T extends { recheckStatus?: RecheckStatus; nextRecheckAt?: string | null }>(injuries: readonly T[]): T[] {
  const rank = (i: T) => recheckRank(i.recheckStatus ?? 'none');
  return injuries
    .map((injury, position) => ({ injury, position }))
    .sort((a, b) => {
      const byRank = rank(a.injury) - rank(b.injury);
      if (byRank !== 0) return byRank;
      if (rank(a.injury) < 2) return Date.parse(a.injury.nextRecheckAt!) - Date.parse(b.injury.nextRecheckAt!);
      return a.position - b.position;
    })
    .map(({ injury }) => injury);
}
