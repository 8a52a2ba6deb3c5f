import type { SessionUser } from '../../shared/auth/schemas';
import { treatmentConsentMissingMessage, treatmentConsentRequiredCode } from '../../shared/clinic/treatment-consent';
import { AppError } from '../errors';
import { Athlete } from '../models';

/** A run cannot be created until the athlete's consent to treatment is on record. */
export async function assertTreatmentConsent(actor: SessionUser, athleteId: string): Promise<void> {
  const athlete = await Athlete.findOne({ where: { id: athleteId, clinicId: actor.clinicId }, attributes: ['id', 'consentToTreatment'] });
  if (!athlete) throw AppError.notFound('Athlete');
  if (!athlete.consentToTreatment) throw AppError.conflict(treatmentConsentMissingMessage, treatmentConsentRequiredCode, { athleteId });
}
