import { DateTime } from 'luxon';

/** Age of majority for consent to treatment; a clinic rule of ours, the common age in most jurisdictions. */
export const guardianConsentUnderAge = 18;

/**
 * Mendstep stores a year of birth only, so the age on the day is known only to within a year: someone who
 * reaches 18 this calendar year (in the clinic's zone) may still be 17 today. Such an athlete is treated as
 * under 18 until December, erring on the safe side (docs/decisions/0103-guardian-consent-errs-safe.md,
 * which replaces 0073's reading).
 */
export function ageThisYear(yearOfBirth: number, now: Date, timeZone: string): number {
  return DateTime.fromJSDate(now).setZone(timeZone).year - yearOfBirth;
}

/** Why a guardian's consent is needed, in words for the screen; null when the athlete is surely 18 or over. */
export function guardianConsentReason(yearOfBirth: number, now: Date, timeZone: string): string | null {
  const age = ageThisYear(yearOfBirth, now, timeZone);
  if (age < guardianConsentUnderAge) return `Born in ${yearOfBirth}, so under 18 all this year (turns ${age} this year).`;
  if (age === guardianConsentUnderAge) {
    return `Born in ${yearOfBirth}, so turns 18 this year and may still be 17 today: with only a year of birth on record, a guardian's consent is needed until the new year.`;
  }
  return null;
}

export function needsGuardianConsent(yearOfBirth: number, now: Date, timeZone: string): boolean {
  return guardianConsentReason(yearOfBirth, now, timeZone) !== null;
}

export const guardianConsentMissingMessage =
  "This athlete is or may be under 18: record a parent's or guardian's consent (who gave it, and when) on the athlete's page before starting a run.";
