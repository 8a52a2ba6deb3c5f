import { useParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { InjuryDetail } from '../../features/injuries/components/injury-detail';
import { AppShell } from '../layout/app-shell';

export function InjuryRoute() {
  const { id = '' } = useParams();
  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <InjuryDetail injuryId={id} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
