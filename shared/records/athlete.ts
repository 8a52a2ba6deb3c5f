import { z } from 'zod';
import { boundedText } from './fields';

const earliestYearOfBirth = 1900;

/** The upper bound moves with the calendar, so it is checked at parse time rather than fixed at import. */
const yearOfBirth = z
  .number({ error: `Year of birth must be a whole number from ${earliestYearOfBirth} to this year` })
  .int(`Year of birth must be a whole number from ${earliestYearOfBirth} to this year`)
  .superRefine((year, ctx) => {
    const thisYear = new Date().getFullYear();
    if (year < earliestYearOfBirth || year > thisYear) {
      ctx.addIssue({
        code: 'custom',
        message: `Year of birth must be between ${earliestYearOfBirth} and ${thisYear}`,
      });
    }
  })
  .describe('Four-digit year');

const athleteFields = {
  name: boundedText('Name', 120, 1),
  yearOfBirth,
  sport: boundedText('Sport', 80, 1).describe('Free text; football codes are recognised from it at compute time'),
  position: boundedText('Position', 80).nullable().optional(),
  email: z
    .email({ error: 'Email must be a valid address, e.g. name@example.org' })
    .max(254, 'Email must be at most 254 characters')
    .nullable()
    .optional()
    .describe("The athlete's address for home-care e-mails"),
  consentToTreatment: z.boolean({ error: 'Consent to treatment must be true or false' }).optional(),
  guardianConsent: z
    .object({ guardianName: boundedText('Guardian name', 120, 2).describe('The parent or guardian who consented') })
    .nullable()
    .optional()
    .describe("A parent's or guardian's consent for an athlete under 18; recorded with who took it and when, null withdraws it"),
  notes: boundedText('Notes', 4000).nullable().optional(),
};

export const athleteCreateSchema = z.object(athleteFields);
export type AthleteCreate = z.infer<typeof athleteCreateSchema>;
export type AthleteCreateInput = z.input<typeof athleteCreateSchema>;

export const athleteUpdateSchema = z.object(athleteFields).partial();
export type AthleteUpdate = z.infer<typeof athleteUpdateSchema>;

export const athleteSortFields = ['name', 'yearOfBirth', 'createdAt'] as const;
export const sortDirections = ['asc', 'desc'] as const;

/** Query strings arrive as text, so page numbers are coerced before their ranges are checked. */
export const athleteListQuerySchema = z.object({
  q: boundedText('Search', 120).optional().describe('Matched against name, sport and position'),
  sort: z
    .enum(athleteSortFields, { error: `Sort must be one of: ${athleteSortFields.join(', ')}` })
    .default('name'),
  direction: z.enum(sortDirections, { error: 'Direction must be asc or desc' }).default('asc'),
  page: z.coerce
    .number({ error: 'Page must be a whole number of 1 or more' })
    .int('Page must be a whole number of 1 or more')
    .min(1, 'Page must be a whole number of 1 or more')
    .default(1),
  pageSize: z.coerce
    .number({ error: 'Page size must be between 1 and 100' })
    .int('Page size must be a whole number between 1 and 100')
    .min(1, 'Page size must be between 1 and 100')
    .max(100, 'Page size must be between 1 and 100')
    .default(20),
});
export type AthleteListQuery = z.infer<typeof athleteListQuerySchema>;
