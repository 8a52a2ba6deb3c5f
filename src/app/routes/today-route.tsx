import { RequireAuth } from '../../features/auth/components/require-auth';
import { AppShell } from '../layout/app-shell';

export function TodayRoute() {
  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="text-2xl font-semibold">Today</h1>
          <p className="mt-2 text-ink-muted">Good to see you, {user.name.split(' ')[0]}. Open injuries and re-checks for {user.clinicName ?? 'your clinic'} appear here.</p>
        </AppShell>
      )}
    </RequireAuth>
  );
}
