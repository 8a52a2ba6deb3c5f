import { RequireAuth } from '../../features/auth/components/require-auth';
import { StaffTable } from '../../features/staff/components/staff-table';
import { AppShell } from '../layout/app-shell';

export function StaffRoute() {
  return (
    <RequireAuth roles={['admin']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="mb-4 text-2xl font-semibold">Staff</h1>
          <StaffTable />
        </AppShell>
      )}
    </RequireAuth>
  );
}
