import { z } from 'zod';
import { instantYearsMessage, isSafeText, isSensibleInstant, unsafeTextMessage } from '../text-safety';

/**
 * Field builders shared by the record schemas, so every range error reads the same way and names its range
 * and unit ("Knee flexion must be between 0 and 160°").
 */

/** Client and server clocks disagree by a little; a time "in the future" by less than this is accepted. */
export const allowedClockSkewMinutes = 5;

interface RangeOptions {
  label: string;
  min: number;
  max: number;
  /** Appended to the numbers in messages: '°', ' cm', ' mm', '' for unitless scales. */
  unit: string;
  integer?: boolean;
  description: string;
}

export function rangeMessage({ label, min, max, unit, integer }: Omit<RangeOptions, 'description'>): string {
  return `${label} must be ${integer ? 'a whole number ' : ''}between ${min} and ${max}${unit}`;
}

export function rangedNumber(options: RangeOptions) {
  const message = rangeMessage(options);
  const base = z.number({ error: message }).min(options.min, message).max(options.max, message);
  return (options.integer ? base.int(message) : base).describe(options.description);
}

export function boundedText(label: string, max: number, min = 0) {
  const message =
    min > 0 ? `${label} must be between ${min} and ${max} characters` : `${label} must be at most ${max} characters`;
  const base = safeText(label).trim().max(max, message);
  return min > 0 ? base.min(min, message) : base;
}

/** Any text input: refuses NUL and lone surrogates (see shared/text-safety.ts) with the field's own label. */
export function safeText(label: string) {
  return z.string({ error: `${label} must be text` }).refine(isSafeText, { error: `${label} ${unsafeTextMessage}` });
}

/** An ISO 8601 date-time with an offset (a real instant, never a zone-less local time), in sensible years. */
export function isoInstant(label: string) {
  return z.iso
    .datetime({ offset: true, error: `${label} must be an ISO 8601 date-time with a time zone, e.g. 2025-03-30T14:05:00Z` })
    .refine((value) => isSensibleInstant(Date.parse(value)), { error: `${label} ${instantYearsMessage}` })
    .describe(`${label}, ISO 8601 with offset`);
}

/** An ISO instant that has already happened, judged at parse time with a few minutes' clock skew allowed. */
export function pastInstant(label: string) {
  return isoInstant(label).refine((value) => Date.parse(value) <= Date.now() + allowedClockSkewMinutes * 60_000, {
    error: `${label} cannot be in the future`,
  });
}

export function isPresent<T>(value: T | null | undefined): value is T {
  return value !== null && value !== undefined;
}
