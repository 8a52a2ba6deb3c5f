import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { CheckCircle2 } from 'lucide-react';
import { PASSWORD_MIN_LENGTH } from '../../../../shared/auth/schemas';
import { setPasswordFormSchema, type SetPasswordForm as SetPasswordValues } from '../../../../shared/mail/account-schemas';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { useLinkToken } from '../api/get-link-token';
import { useSetPassword } from '../api/set-password';
import { primaryLinkClass, SuccessNote, textLinkClass } from './auth-card';

/** The page behind an invitation or reset link: who it is for, then the new password twice. */
export function SetPasswordForm({ token }: { token: string }) {
  const link = useLinkToken(token);
  const setPassword = useSetPassword();
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<SetPasswordValues>({ resolver: zodResolver(setPasswordFormSchema), defaultValues: { password: '', confirm: '' } });

  if (!token || link.isError) {
    const message = !token
      ? 'This link is incomplete. Open it again from the e-mail.'
      : link.error instanceof ApiError
        ? link.error.message
        : 'Could not reach Mendstep. Check the connection and reload.';
    return (
      <div className="flex flex-col gap-4">
        <Notice kind="error" title="This link cannot be used">
          {message}
        </Notice>
        <Link to="/forgot-password" className={textLinkClass}>
          Ask for a new link
        </Link>
      </div>
    );
  }
  if (link.isPending) return <p className="text-ink-muted">Checking the link…</p>;

  if (setPassword.isSuccess) {
    return (
      <div className="flex flex-col gap-4">
        <SuccessNote icon={CheckCircle2} title="Password set">
          Sign in as {setPassword.data.email} with your new password.
        </SuccessNote>
        <Link to="/sign-in" className={primaryLinkClass}>
          Sign in
        </Link>
      </div>
    );
  }

  const info = link.data;
  const serverError = setPassword.error instanceof ApiError ? setPassword.error.message : setPassword.error ? 'Could not reach Mendstep. Check the connection and try again.' : null;

  return (
    <form
      onSubmit={handleSubmit((values) => setPassword.mutate({ token, password: values.password }))}
      noValidate
      className="flex flex-col gap-4"
      aria-label="Choose a password"
    >
      <p>
        {info.purpose === 'invitation' ? `Welcome, ${info.name}. ` : ''}
        Choose a password for <strong>{info.email}</strong>.
      </p>
      {serverError ? (
        <Notice kind="error" title="Password not set">
          {serverError}
        </Notice>
      ) : null}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words make a strong one.`}
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField label="New password again" type="password" autoComplete="new-password" error={errors.confirm?.message} {...register('confirm')} />
      {info.purpose === 'password-reset' ? <p className="text-sm text-ink-muted">Setting a new password signs you out on every other device.</p> : null}
      <Button type="submit" disabled={setPassword.isPending}>
        {setPassword.isPending ? 'Saving…' : 'Set password'}
      </Button>
    </form>
  );
}
