import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signInSchema, type SignInInput } from '../../../../shared/auth/schemas';
import type { SessionUser } from '../../../../shared/auth/schemas';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { Notice } from '../../../components/ui/notice';
import { useSignIn } from '../api/sign-in';

export function SignInForm({ onSignedIn }: { onSignedIn: (user: SessionUser) => void }) {
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit((values) => signIn.mutate(values, { onSuccess: onSignedIn }));
  const serverError = signIn.error instanceof ApiError ? signIn.error.message : signIn.error ? 'Could not reach Mendstep. Check the connection and try again.' : null;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Sign in">
      {serverError ? <Notice kind="error" title="Not signed in">{serverError}</Notice> : null}
      <TextField label="E-mail" type="email" autoComplete="username" error={errors.email?.message} {...register('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...register('password')} />
      <Button type="submit" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
