import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { MailCheck } from 'lucide-react';
import { passwordResetRequestSchema, type PasswordResetRequest } from '../../../../shared/mail/account-schemas';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { useRequestPasswordReset } from '../api/request-password-reset';
import { SuccessNote, textLinkClass } from './auth-card';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<PasswordResetRequest>({ resolver: zodResolver(passwordResetRequestSchema), defaultValues: { email: '' } });

  if (request.isSuccess) {
    return (
      <div className="flex flex-col gap-4">
        <SuccessNote icon={MailCheck} title="Check your e-mail">
          {request.data.message}
        </SuccessNote>
        <Link to="/sign-in" className={textLinkClass}>
          Back to sign in
        </Link>
      </div>
    );
  }

  const serverError =
    request.error instanceof ApiError ? request.error.message : request.error ? 'Could not reach Mendstep. Check the connection and try again.' : null;

  return (
    <form onSubmit={handleSubmit((values) => request.mutate(values))} noValidate className="flex flex-col gap-4" aria-label="Ask for a reset link">
      {serverError ? (
        <Notice kind="error" title="Not sent">
          {serverError}
        </Notice>
      ) : null}
      <TextField label="E-mail" type="email" autoComplete="username" error={errors.email?.message} {...register('email')} />
      <Button type="submit" disabled={request.isPending}>
        {request.isPending ? 'Sending…' : 'Send me a reset link'}
      </Button>
      <Link to="/sign-in" className={textLinkClass}>
        Back to sign in
      </Link>
    </form>
  );
}
