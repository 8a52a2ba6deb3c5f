import { Link } from 'react-router-dom';
import { treatmentConsentRequiredCode } from '../../../../shared/clinic/treatment-consent';
import { ApiError } from '../../../lib/api-client';

/** Refusals that are put right on the athlete's page, where consents are recorded. */
const consentCodes = new Set([treatmentConsentRequiredCode, 'guardian_consent_required']);

/** Why a run could not start, with the way to put it right: the athlete's page for a missing consent. */
export function RunRefused({ error, injuryId }: { error: unknown; injuryId: string }) {
  const message = error instanceof Error ? error.message : 'Could not start the run.';
  const athleteId = error instanceof ApiError && consentCodes.has(error.code) ? (error.extra.athleteId as string | undefined) : undefined;
  return (
    <div role="alert" className="flex flex-col gap-3">
      <p className="text-ember-700">{message}</p>
      {athleteId ? (
        <Link to={`/athletes/${athleteId}`} className="font-medium underline">
          Record consent on the athlete&rsquo;s page
        </Link>
      ) : null}
      <Link to={`/injuries/${injuryId}`} className="underline">
        Back to the injury
      </Link>
    </div>
  );
}
