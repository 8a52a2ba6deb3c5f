import { RequireAuth } from '../../features/auth/components/require-auth';
import { ClinicSettingsScreen } from '../../features/settings/components/settings-form';
import { AppShell } from '../layout/app-shell';

export function SettingsRoute() {
  return (
    <RequireAuth roles={['admin']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="mb-1 text-2xl font-semibold">Settings</h1>
          <p className="mb-4 text-ink-muted">The rules {user.clinicName ?? 'your clinic'} treats by. Each default says where it comes from.</p>
          <ClinicSettingsScreen />
        </AppShell>
      )}
    </RequireAuth>
  );
}
