import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import type { Role } from '../../../../shared/auth/roles';
import type { SessionUser } from '../../../../shared/auth/schemas';
import { useMe } from '../api/get-me';

/** Sends a signed-out visitor to sign in and back here afterwards; a wrong role sees a plain refusal. */
export function RequireAuth({ roles, children }: { roles?: Role[]; children: (user: SessionUser) => ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <p className="p-6 text-ink-muted">Loading…</p>;
  if (me.isError) return <p className="p-6 text-ember-700">Could not reach Mendstep. Reload to try again.</p>;
  if (!me.data) {
    const next = encodeURIComponent(location.pathname + location.search);
    return <Navigate to={`/sign-in?next=${next}`} replace />;
  }
  if (roles && !roles.includes(me.data.role)) {
    return (
      <main className="p-6">
        <h1 className="text-2xl font-semibold">Not available to your role</h1>
        <p className="mt-2 text-ink-muted">This screen is for {roles.join(' or ')} accounts.</p>
      </main>
    );
  }
  return <>{children(me.data)}</>;
}
