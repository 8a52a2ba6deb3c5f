import type { SessionUser } from '../../shared/auth/schemas';
import { guardianConsentMissingMessage, guardianConsentReason, needsGuardianConsent } from '../../shared/clinic/guardian-consent';
import type { AthleteView } from '../../shared/records/responses';
import { AppError } from '../errors';
import { Athlete, User } from '../models';
import { getClinicSettings } from './clinic-settings-service';

/** Recorded with who took it and when; withdrawing it (null) clears all three. Unchanged when omitted or the same. */
export function guardianConsentFields(actor: SessionUser, consent: { guardianName: string } | null | undefined, current?: Athlete) {
  if (consent === undefined) return {};
  if (consent === null) return { guardianName: null, guardianConsentRecordedBy: null, guardianConsentRecordedAt: null };
  if (current?.guardianName === consent.guardianName && current.guardianConsentRecordedAt) return {};
  return { guardianName: consent.guardianName, guardianConsentRecordedBy: actor.id, guardianConsentRecordedAt: new Date() };
}

export async function guardianConsentView(athlete: Athlete): Promise<Pick<AthleteView, 'guardianConsent' | 'needsGuardianConsent' | 'guardianConsentReason'>> {
  const [settings, recordedBy] = await Promise.all([
    getClinicSettings(athlete.clinicId),
    athlete.guardianConsentRecordedBy ? User.findByPk(athlete.guardianConsentRecordedBy, { attributes: ['name'] }) : null,
  ]);
  const now = new Date();
  return {
    guardianConsent:
      athlete.guardianName && athlete.guardianConsentRecordedAt
        ? { guardianName: athlete.guardianName, recordedAt: athlete.guardianConsentRecordedAt.toISOString(), recordedByName: recordedBy?.name ?? null }
        : null,
    needsGuardianConsent: needsGuardianConsent(athlete.yearOfBirth, now, settings.timeZone),
    guardianConsentReason: guardianConsentReason(athlete.yearOfBirth, now, settings.timeZone),
  };
}

/** A run cannot start for an athlete who is or may be under 18 until a guardian's consent is on record. */
export async function assertGuardianConsent(actor: SessionUser, athleteId: string): Promise<void> {
  const athlete = await Athlete.findOne({ where: { id: athleteId, clinicId: actor.clinicId } });
  if (!athlete) throw AppError.notFound('Athlete');
  const settings = await getClinicSettings(actor.clinicId);
  if (needsGuardianConsent(athlete.yearOfBirth, new Date(), settings.timeZone) && !(athlete.guardianName && athlete.guardianConsentRecordedAt)) {
    throw AppError.conflict(guardianConsentMissingMessage, 'guardian_consent_required', { athleteId });
  }
}
