import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { homePathByRole } from '../../../shared/auth/roles';
import { useMe } from '../../features/auth/api/get-me';
import { SignInForm } from '../../features/auth/components/sign-in-form';

/** Only same-site paths are followed after sign-in, never another origin. */
function safeNext(next: string | null): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}

export function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  const next = safeNext(params.get('next'));

  if (me.data) return <Navigate to={next ?? homePathByRole[me.data.role]} replace />;

  return (
    <main className="flex min-h-screen items-center justify-center bg-paper px-4">
      <div className="w-full max-w-md rounded-2xl bg-paper-raised p-8 shadow-sm ring-1 ring-ink/10">
        <h1 className="text-3xl font-bold tracking-tight">Mendstep</h1>
        <p className="mb-6 mt-1 text-ink-muted">Guided contusion care at the treatment table. Sign in to continue.</p>
        <SignInForm onSignedIn={(user) => navigate(next ?? homePathByRole[user.role], { replace: true })} />
        <Link to="/forgot-password" className="mt-4 inline-flex min-h-target items-center font-medium underline underline-offset-4">
          Forgot your password?
        </Link>
      </div>
    </main>
  );
}
