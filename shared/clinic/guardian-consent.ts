import { DateTime } from 'luxon';

/** Age of majority for consent to treatment; a clinic rule of ours, the common age in most jurisdictions. */
export const guardianConsentUnderAge = 18;

/**
 * Mendstep stores a year of birth only, so "under 18" is read by year: the age the athlete reaches in the
 * current calendar year (in the clinic's zone) below 18. An athlete who turns 18 later this year therefore
 * counts as 18 from January (docs/decisions/0073-guardian-consent-by-year-of-birth.md); the therapist can
 * record a guardian's consent for anyone when in doubt.
 */
export function ageThisYear(yearOfBirth: number, now: Date, timeZone: string): number {
  return DateTime.fromJSDate(now).setZone(timeZone).year - yearOfBirth;
}

export function needsGuardianConsent(yearOfBirth: number, now: Date, timeZone: string): boolean {
  return ageThisYear(yearOfBirth, now, timeZone) < guardianConsentUnderAge;
}

export const guardianConsentMissingMessage =
  "This athlete is under 18: record a parent's or guardian's consent (who gave it, and when) on the athlete's page before starting a run.";
