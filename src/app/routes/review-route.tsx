import { RequireAuth } from '../../features/auth/components/require-auth';
import { AppShell } from '../layout/app-shell';

export function ReviewRoute() {
  return (
    <RequireAuth roles={['supervisor', 'admin']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="text-2xl font-semibold">Review desk</h1>
          <p className="mt-2 text-ink-muted">Completed runs waiting for review at {user.clinicName ?? 'your clinic'} appear here.</p>
        </AppShell>
      )}
    </RequireAuth>
  );
}
