import { AuthCard } from '../../features/password/components/auth-card';
import { ForgotPasswordForm } from '../../features/password/components/forgot-password-form';

export function ForgotPasswordRoute() {
  return (
    <AuthCard title="Forgot your password?" intro="Enter the e-mail address you sign in with. We will send a link to choose a new password.">
      <ForgotPasswordForm />
    </AuthCard>
  );
}
