import { useCallback, useEffect, useRef, useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { createRun, endRunEarly, getRun } from '../../features/runs/api/run-queries';
import { Button } from '../../components/ui/button';
import { RunRefused } from '../../features/runs/components/run-refused';
import type { RunView } from '../../../shared/runs/responses';
import { ApiError } from '../../lib/api-client';
import { AppShell } from '../layout/app-shell';

/**
 * `/runs/new?injuryId=…`: creates the run and goes on to screening. When a run is already under way for the
 * injury, the therapist chooses: resume it, or end it (with a reason, for the log) and start a new one.
 */
export function StartRun({ injuryId }: { injuryId: string }) {
  const navigate = useNavigate();
  const [error, setError] = useState<unknown>(null);
  const [active, setActive] = useState<RunView | null>(null);
  const [reason, setReason] = useState('');
  const [ending, setEnding] = useState(false);
  const started = useRef(false);

  const start = useCallback(() => {
    createRun(injuryId)
      .then((run) => navigate(`/runs/${run.id}/screening`, { replace: true }))
      .catch(async (err) => {
        const runId = err instanceof ApiError && err.code === 'run_active' ? (err.extra.runId as string | undefined) : undefined;
        if (runId) {
          const { run } = await getRun(runId);
          // Screening not finished yet: nothing has run, so carry on with it.
          if (run.status === 'screening') navigate(`/runs/${run.id}/screening`, { replace: true });
          else setActive(run);
          return;
        }
        setError(err);
      });
  }, [injuryId, navigate]);

  useEffect(() => {
    if (started.current) return;
    started.current = true;
    start();
  }, [start]);

  if (error) return <RunRefused error={error} injuryId={injuryId} />;
  if (active) {
    const endAndStart = async () => {
      setEnding(true);
      try {
        await endRunEarly(active.id, reason.trim());
        setActive(null);
        start();
      } catch (err) {
        setError(err);
      } finally {
        setEnding(false);
      }
    };
    return (
      <section className="flex max-w-xl flex-col gap-4" data-testid="run-already-active">
        <p>
          A run for {active.athleteName} ({active.injuryLabel}) is already in progress, started by {active.therapistName}. Only one run at a
          time can be under way for an injury.
        </p>
        <Link to={`/table/${active.id}`} className="inline-flex min-h-target items-center justify-center rounded-lg bg-ink px-4 py-2 font-medium text-paper">
          Resume that run
        </Link>
        <div className="flex flex-col gap-2 rounded-lg border border-ink/20 p-3">
          <label htmlFor="end-reason" className="font-medium">
            Or end it and start a new one — why is it ending?
          </label>
          <textarea id="end-reason" className="min-h-20 rounded-md border border-ink/30 p-2" value={reason} onChange={(e) => setReason(e.target.value)} maxLength={500} />
          <Button variant="secondary" disabled={!reason.trim() || ending} onClick={() => void endAndStart()}>
            End it and start a new run
          </Button>
        </div>
      </section>
    );
  }
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
