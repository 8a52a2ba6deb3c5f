import { RequireAuth } from '../../features/auth/components/require-auth';
import { SequenceEditor } from '../../features/sequences/components/sequence-editor';
import { AppShell } from '../layout/app-shell';

export function SequencesRoute() {
  return (
    <RequireAuth roles={['therapist', 'supervisor', 'admin']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="text-2xl font-semibold">Sequences</h1>
          <p className="mb-4 text-ink-muted">The clinic’s steps for each phase of healing; every run’s plan starts from the current version.</p>
          <SequenceEditor canEdit={user.role === 'supervisor'} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
