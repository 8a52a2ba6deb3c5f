import { RequireAuth } from '../../features/auth/components/require-auth';
import { DataRightsScreen } from '../../features/data-rights/components/data-rights-screen';
import { AppShell } from '../layout/app-shell';

export function DataRightsRoute() {
  return (
    <RequireAuth roles={['admin']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="mb-4 text-2xl font-semibold">Data rights</h1>
          <DataRightsScreen />
        </AppShell>
      )}
    </RequireAuth>
  );
}
