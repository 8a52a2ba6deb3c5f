import { DateTime } from 'luxon';
import { z } from 'zod';
import { phaseSchema } from '../phase';
import { isSensibleInstant } from '../text-safety';

/**
 * The review desk's query strings, parsed the same way by the server and (for building links) the client.
 * Every value arrives as text; page numbers are coerced.
 */

/** How a finished run ended, as the review desk files it: the run's stored status (stop-elevate-refer is a fall back). */
export const reviewOutcomes = ['completed', 'fell-back', 'stopped-referred', 'ended-early', 'abandoned'] as const;
export const reviewOutcomeSchema = z.enum(reviewOutcomes, { error: `Outcome must be one of: ${reviewOutcomes.join(', ')}` });
export type ReviewOutcome = z.infer<typeof reviewOutcomeSchema>;

export const reviewSortFields = ['createdAt', 'athleteName', 'therapistName', 'phase', 'outcome'] as const;
export const reviewSortFieldSchema = z.enum(reviewSortFields, { error: `Sort must be one of: ${reviewSortFields.join(', ')}` });
export type ReviewSortField = z.infer<typeof reviewSortFieldSchema>;

export const sortDirections = ['asc', 'desc'] as const;

export const defaultReviewPageSize = 25;
export const maxReviewPageSize = 100;

const isoDatePattern = /^\d{4}-\d{2}-\d{2}$/;

/** A calendar day ("2026-12-02", read in the clinic's zone) or an instant with its offset. */
function dayOrInstant(label: string) {
  const message = `${label} must be a date (YYYY-MM-DD) or an ISO 8601 date-time with a time zone`;
  return z
    .string({ error: message })
    .trim()
    .refine((value) => (isoDatePattern.test(value) ? DateTime.fromISO(value, { zone: 'utc' }).isValid : z.iso.datetime({ offset: true }).safeParse(value).success), {
      error: message,
    })
    // Year 0000 parses as a date but PostgreSQL refuses it: only sensible years reach a query.
    .refine((value) => isSensibleInstant(Date.parse(isoDatePattern.test(value) ? `${value}T12:00:00Z` : value)), {
      error: `${label} must be between the years 1900 and 2199`,
    });
}

const booleanText = (label: string) => z.enum(['true', 'false'], { error: `${label} must be true or false` });
const id = (label: string) => z.guid({ error: `${label} must be a record id (UUID)` });

/** Earliest and latest instants a range bound can mean, zone-free, for the "from after to" check alone. */
function loosestBounds(from: string, to: string): { from: number; to: number } {
  const start = isoDatePattern.test(from) ? Date.parse(`${from}T00:00:00Z`) - 14 * 3_600_000 : Date.parse(from);
  const end = isoDatePattern.test(to) ? Date.parse(`${to}T00:00:00Z`) + 38 * 3_600_000 : Date.parse(to);
  return { from: start, to: end };
}

function checkRange(value: { from?: string; to?: string }, ctx: z.RefinementCtx) {
  if (!value.from || !value.to) return;
  const bounds = loosestBounds(value.from, value.to);
  // Time zones span 26 hours, so only a range that is backwards in every zone is refused here; the service
  // checks again in the clinic's own zone.
  if (bounds.from > bounds.to) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end of the range must not be before its start' });
}

const dateRangeFields = {
  from: dayOrInstant('From').optional(),
  to: dayOrInstant('To').optional(),
};

const filterFields = {
  ...dateRangeFields,
  therapistId: id('Therapist').optional(),
  athleteId: id('Athlete').optional(),
  phase: phaseSchema.optional(),
  outcome: reviewOutcomeSchema.optional(),
  noteSigned: booleanText('Note signed').optional(),
  /** Only 'true' filters; 'false' is accepted and means "no attention filter". */
  attention: booleanText('Attention').optional(),
};

/** The filters alone: the CSV export takes these (every matching run, no paging). */
export const reviewFilterSchema = z.object(filterFields).superRefine(checkRange);
export type ReviewFilter = z.infer<typeof reviewFilterSchema>;

export const reviewRunsQuerySchema = z
  .object({
    ...filterFields,
    sort: reviewSortFieldSchema.default('createdAt'),
    direction: z.enum(sortDirections, { error: 'Direction must be asc or desc' }).default('desc'),
    page: z.coerce
      .number({ error: 'Page must be a whole number from 1' })
      .int('Page must be a whole number from 1')
      .min(1, 'Page must be a whole number from 1')
      .max(1_000_000, 'Page must be at most 1000000')
      .default(1),
    pageSize: z.coerce
      .number({ error: `Page size must be a whole number from 1 to ${maxReviewPageSize}` })
      .int(`Page size must be a whole number from 1 to ${maxReviewPageSize}`)
      .min(1, `Page size must be a whole number from 1 to ${maxReviewPageSize}`)
      .max(maxReviewPageSize, `Page size must be a whole number from 1 to ${maxReviewPageSize}`)
      .default(defaultReviewPageSize),
  })
  .superRefine(checkRange);
export type ReviewRunsQuery = z.infer<typeof reviewRunsQuerySchema>;
export type ReviewRunsQueryInput = z.input<typeof reviewRunsQuerySchema>;

export const adherenceQuerySchema = z.object(dateRangeFields).superRefine(checkRange);
export type AdherenceQuery = z.infer<typeof adherenceQuerySchema>;

/** Without a range the adherence figures cover the last 28 days: four weeks of runs, a supervisor's usual look back. */
export const defaultAdherenceDays = 28;

export interface ResolvedRange {
  /** Inclusive. */
  from: Date | null;
  /** Exclusive. */
  to: Date | null;
}

/**
 * A day is the whole of that day in the clinic's zone: "from 2026-12-01 to 2026-12-02" covers both days.
 * An instant is taken as given (from inclusive, to exclusive).
 */
export function resolveRange(range: { from?: string; to?: string }, timeZone: string): ResolvedRange {
  const from = range.from
    ? isoDatePattern.test(range.from)
      ? DateTime.fromISO(range.from, { zone: timeZone }).startOf('day').toJSDate()
      : new Date(range.from)
    : null;
  const to = range.to
    ? isoDatePattern.test(range.to)
      ? DateTime.fromISO(range.to, { zone: timeZone }).startOf('day').plus({ days: 1 }).toJSDate()
      : new Date(range.to)
    : null;
  return { from, to };
}
