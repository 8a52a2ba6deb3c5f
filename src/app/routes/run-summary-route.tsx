import { Link, useParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { useRun } from '../../features/runs/api/run-queries';
import { PhaseBadge } from '../../features/runs/components/phase-badge';
import { RunSummary } from '../../features/runs/components/run-summary';
import { AppShell } from '../layout/app-shell';

function Summary({ runId }: { runId: string }) {
  const run = useRun(runId);
  if (run.isPending) return <p className="text-ink-muted">Loading the run…</p>;
  if (run.isError) return <p className="text-ember-700">{run.error.message}</p>;
  const view = run.data.run;
  return (
    <div className="flex flex-col gap-4">
      <header className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold">Run summary — {view.athleteName}</h1>
        <PhaseBadge phase={view.phase} />
        <span className="capitalize text-ink-muted">{view.injuryLabel}</span>
      </header>
      <RunSummary detail={run.data} />
      <Link to={`/injuries/${view.injuryId}`} className="underline">
        Back to the injury: measurements, home care and the next run
      </Link>
    </div>
  );
}

export function RunSummaryRoute() {
  const { id = '' } = useParams();
  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <Summary runId={id} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
