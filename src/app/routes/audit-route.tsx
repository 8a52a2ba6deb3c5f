import { RequireAuth } from '../../features/auth/components/require-auth';
import { AuditViewer } from '../../features/audit/components/audit-viewer';
import { AppShell } from '../layout/app-shell';

export function AuditRoute() {
  return (
    <RequireAuth roles={['admin', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="mb-1 text-2xl font-semibold">Audit trail</h1>
          <p className="mb-4 text-ink-muted">Who changed what, and when, at {user.clinicName ?? 'your clinic'}. Newest first.</p>
          <AuditViewer />
        </AppShell>
      )}
    </RequireAuth>
  );
}
