import { Link, useParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { NoteEditor } from '../../features/notes/components/note-editor';
import { useRun } from '../../features/runs/api/run-queries';
import { PhaseBadge } from '../../features/runs/components/phase-badge';
import { RunSummary } from '../../features/runs/components/run-summary';
import { activeStatuses } from '../../../shared/runs/responses';
import { AppShell } from '../layout/app-shell';

function Summary({ runId, writesNote }: { runId: string; writesNote: boolean }) {
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
      {/* A run stopped at screening still gets a note: the referral is part of the record. */}
      {activeStatuses.includes(view.status) ? null : writesNote ? (
        <NoteEditor runId={runId} canEdit />
      ) : (
        <Link to={`/review/runs/${runId}`} className="font-medium underline">
          Review this run and sign off its session note on the review desk
        </Link>
      )}
      {view.status === 'stopped-referred' || view.outcome === 'stop-elevate-refer' ? (
        <Link to={`/injuries/${view.injuryId}/referral?runId=${view.id}`} className="inline-flex min-h-target items-center self-start rounded-lg bg-ink px-4 font-medium text-paper">
          Referral summary for the physician
        </Link>
      ) : null}
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
          <Summary runId={id} writesNote={user.role === 'therapist'} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
