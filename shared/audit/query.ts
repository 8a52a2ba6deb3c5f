import { DateTime } from 'luxon';
import { z } from 'zod';
import { isSensibleInstant } from '../text-safety';

/**
 * The audit viewer's query string, parsed alike by the server and (for links and the CSV address) the client.
 * Dates are calendar days in the clinic's zone, both ends included.
 */

export const defaultAuditPageSize = 50;
export const maxAuditPageSize = 200;

const day = (label: string) =>
  z
    .string({ error: `${label} must be a date (YYYY-MM-DD)` })
    .trim()
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date (YYYY-MM-DD)`)
    .refine((value) => DateTime.fromISO(value, { zone: 'utc' }).isValid, { error: `${label} must be a real calendar date` })
    .refine((value) => isSensibleInstant(Date.parse(`${value}T12:00:00Z`)), { error: `${label} must be between the years 1900 and 2199` });

const auditFilterFields = {
  userId: z.guid({ error: 'Person must be a staff id (UUID)' }).optional().describe('Only what this member of staff did'),
  recordType: z
    .string({ error: 'Record type must be text' })
    .trim()
    .regex(/^[a-z][a-z-]{0,39}$/, 'Record type must be one of the record types listed by /api/audit/filters')
    .optional(),
  from: day('From').optional(),
  to: day('To').optional(),
};

function checkRange(value: { from?: string; to?: string }, ctx: z.RefinementCtx) {
  // YYYY-MM-DD strings sort as dates.
  if (value.from && value.to && value.to < value.from) {
    ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end of the range must not be before its start' });
  }
}

export const auditFilterSchema = z.object(auditFilterFields).superRefine(checkRange);
export type AuditFilter = z.infer<typeof auditFilterSchema>;

export const auditQuerySchema = z
  .object({
    ...auditFilterFields,
    page: z.coerce
      .number({ error: 'Page must be a whole number of 1 or more' })
      .int('Page must be a whole number of 1 or more')
      .min(1, 'Page must be a whole number of 1 or more')
      .default(1),
    pageSize: z.coerce
      .number({ error: `Page size must be between 1 and ${maxAuditPageSize}` })
      .int(`Page size must be a whole number between 1 and ${maxAuditPageSize}`)
      .min(1, `Page size must be between 1 and ${maxAuditPageSize}`)
      .max(maxAuditPageSize, `Page size must be between 1 and ${maxAuditPageSize}`)
      .default(defaultAuditPageSize),
  })
  .superRefine(checkRange);
export type AuditQuery = z.infer<typeof auditQuerySchema>;
export type AuditQueryInput = z.input<typeof auditQuerySchema>;

/** Query-string text for a filter set: empty values are left out so links stay short. */
export function auditSearch(query: Partial<AuditQuery>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  return params.toString();
}
