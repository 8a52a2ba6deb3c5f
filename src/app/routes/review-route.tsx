import { RequireAuth } from '../../features/auth/components/require-auth';
import { ReviewDesk } from '../../features/review/components/review-desk';
import { AppShell } from '../layout/app-shell';

export function ReviewRoute() {
  return (
    <RequireAuth roles={['supervisor', 'admin']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="text-2xl font-semibold">Review desk</h1>
          <p className="mb-4 text-ink-muted">What was done at the table at {user.clinicName ?? 'your clinic'}: open a run to read it step by step and sign off its note.</p>
          <ReviewDesk />
        </AppShell>
      )}
    </RequireAuth>
  );
}
