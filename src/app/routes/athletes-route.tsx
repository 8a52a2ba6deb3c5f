import { useNavigate, useSearchParams } from 'react-router-dom';
import { UserPlus } from 'lucide-react';
import { Button } from '../../components/ui/button';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { AddAthletePanel } from '../../features/athletes/components/add-athlete-panel';
import { AthletesTable } from '../../features/athletes/components/athletes-table';
import { AppShell } from '../layout/app-shell';

export function AthletesRoute() {
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  // `?new=1` opens the panel, so Today's "Register an athlete" lands ready to type.
  const adding = params.get('new') === '1';
  const setAdding = (open: boolean) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        if (open) next.set('new', '1');
        else next.delete('new');
        return next;
      },
      { replace: true },
    );

  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
            <h1 className="text-2xl font-semibold">Athletes</h1>
            {adding ? null : (
              <Button onClick={() => setAdding(true)}>
                <UserPlus aria-hidden className="h-4 w-4" /> Add athlete
              </Button>
            )}
          </div>
          {adding ? (
            <div className="mb-6">
              <AddAthletePanel onAdded={(athlete) => navigate(`/athletes/${athlete.id}`)} onCancel={() => setAdding(false)} />
            </div>
          ) : null}
          <AthletesTable />
        </AppShell>
      )}
    </RequireAuth>
  );
}
