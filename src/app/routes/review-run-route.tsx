import { Link, useLocation, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { ArrowLeft } from 'lucide-react';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { NoteReviewPanel } from '../../features/notes/components/note-review-panel';
import { useReviewRun } from '../../features/review/api/get-review-run';
import { reviewKeys } from '../../features/review/api/keys';
import { ReviewRunView } from '../../features/review/components/review-run-view';
import { RunSummary } from '../../features/runs/components/run-summary';
import { AppShell } from '../layout/app-shell';

function ReviewRun({ runId, canSignOff }: { runId: string; canSignOff: boolean }) {
  const detail = useReviewRun(runId);
  const queryClient = useQueryClient();
  if (detail.isPending) return <p className="text-ink-muted">Loading the run…</p>;
  if (detail.isError) return <p className="text-ember-700">{detail.error.message}</p>;
  return (
    <ReviewRunView
      detail={detail.data}
      // A sign-off changes this page and the desk's note column: refresh everything the review desk shows.
      note={<NoteReviewPanel runId={runId} note={detail.data.note} canSignOff={canSignOff} onChanged={() => queryClient.invalidateQueries({ queryKey: reviewKeys.all })} />}
      log={<RunSummary detail={{ run: detail.data.run, entries: detail.data.entries }} />}
    />
  );
}

export function ReviewRunRoute() {
  const { id = '' } = useParams();
  // The desk hands its filters along, so going back returns to the same selection of runs.
  const back = (useLocation().state as { reviewSearch?: string } | null)?.reviewSearch;
  return (
    <RequireAuth roles={['supervisor', 'admin']}>
      {(user) => (
        <AppShell user={user}>
          <Link to={back ? `/review?${back}` : '/review'} className="mb-3 inline-flex min-h-target items-center gap-2 font-medium underline underline-offset-4">
            <ArrowLeft aria-hidden className="h-4 w-4" /> Back to the review desk
          </Link>
          <ReviewRun runId={id} canSignOff={user.role === 'supervisor'} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
