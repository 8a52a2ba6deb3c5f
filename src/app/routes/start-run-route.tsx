import { useEffect, useRef, useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { createRun, getRun } from '../../features/runs/api/run-queries';
import { RunRefused } from '../../features/runs/components/run-refused';
import { ApiError } from '../../lib/api-client';
import { AppShell } from '../layout/app-shell';

/** `/runs/new?injuryId=…`: creates the run (or finds the one in progress) and goes on to screening or table mode. */
export function StartRun({ injuryId }: { injuryId: string }) {
  const navigate = useNavigate();
  const [error, setError] = useState<unknown>(null);
  const started = useRef(false);

  useEffect(() => {
    if (started.current) return;
    started.current = true;
    createRun(injuryId)
      .then((run) => navigate(`/runs/${run.id}/screening`, { replace: true }))
      .catch(async (err) => {
        const runId = err instanceof ApiError && err.code === 'run_active' ? (err.extra.runId as string | undefined) : undefined;
        if (runId) {
          const { run } = await getRun(runId);
          navigate(run.status === 'screening' ? `/runs/${run.id}/screening` : `/table/${run.id}`, { replace: true });
          return;
        }
        setError(err);
      });
  }, [injuryId, navigate]);

  if (error) return <RunRefused error={error} injuryId={injuryId} />;
  return <p className="text-ink-muted">Preparing the run…</p>;
}

export function StartRunRoute() {
  const [params] = useSearchParams();
  const injuryId = params.get('injuryId') ?? '';
  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="mb-4 text-2xl font-semibold">Start a run</h1>
          <StartRun injuryId={injuryId} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
