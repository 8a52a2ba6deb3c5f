import { RequireAuth } from '../../features/auth/components/require-auth';
import { TodayBoard } from '../../features/today/components/today-board';
import { RunsInProgress } from '../../features/runs/components/runs-in-progress';
import { AppShell } from '../layout/app-shell';

export function TodayRoute() {
  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="text-2xl font-semibold">Today</h1>
          <p className="mb-4 mt-1 text-ink-muted">
            Good to see you, {user.name.split(' ')[0]}. Open injuries at {user.clinicName ?? 'your clinic'}, newest first.
          </p>
          <RunsInProgress />
          <TodayBoard />
        </AppShell>
      )}
    </RequireAuth>
  );
}
