import { useParams, useSearchParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { ReferralPage } from '../../features/referral/components/referral-summary';

/** A page of its own, without the app's bars, so it prints as the one sheet a physician receives. */
export function ReferralRoute() {
  const { id = '' } = useParams();
  const [params] = useSearchParams();
  return <RequireAuth roles={['therapist', 'supervisor']}>{() => <ReferralPage injuryId={id} runId={params.get('runId')} />}</RequireAuth>;
}
