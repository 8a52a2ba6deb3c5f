/**
 * No run without the athlete's consent to treatment on record (common practice: informed consent before
 * hands-on treatment). The code and message are shared so the server and the Start-a-run screen agree.
 */
export const treatmentConsentRequiredCode = 'treatment_consent_required';

export const treatmentConsentMissingMessage =
  "No consent to treatment is recorded for this athlete: record it on the athlete's page before starting a run.";
