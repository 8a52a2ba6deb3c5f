import { useSearchParams } from 'react-router-dom';
import { OptOutForm } from '../../features/opt-out/components/opt-out-form';
import { AuthCard } from '../../features/password/components/auth-card';

/** Public: an athlete arrives here from the link in an e-mail, without an account. */
export function OptOutRoute() {
  const [params] = useSearchParams();
  return (
    <AuthCard title="Stop e-mails">
      <OptOutForm token={params.get('token') ?? ''} />
    </AuthCard>
  );
}
