import { useSearchParams } from 'react-router-dom';
import { AuthCard } from '../../features/password/components/auth-card';
import { SetPasswordForm } from '../../features/password/components/set-password-form';

export function SetPasswordRoute() {
  const [params] = useSearchParams();
  return (
    <AuthCard title="Choose your password">
      <SetPasswordForm token={params.get('token') ?? ''} />
    </AuthCard>
  );
}
