import { useNavigate, useParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { useRun } from '../../features/runs/api/run-queries';
import { TableModeScreen } from '../../features/table-mode/components/table-mode-screen';
import { FinishedRun } from '../../features/table-mode/components/finished-run';
import { finishedStatuses } from '../../../shared/runs/responses';

function TableMode({ runId }: { runId: string }) {
  const run = useRun(runId);
  const navigate = useNavigate();
  if (run.isPending) return <p className="p-8 text-2xl text-slate-300">Loading the run…</p>;
  if (run.isError) return <p className="p-8 text-2xl text-red-300">{run.error.message}</p>;
  if (run.data.run.status === 'screening') {
    navigate(`/runs/${runId}/screening`, { replace: true });
    return null;
  }
  // The server decides what a run is: a finished one shows how it ended, never a live step.
  if (finishedStatuses.includes(run.data.run.status)) return <FinishedRun detail={run.data} />;
  return <TableModeScreen detail={run.data} onSessionExpired={() => navigate(`/sign-in?next=${encodeURIComponent(`/table/${runId}`)}`)} />;
}

export function TableRoute() {
  const { runId = '' } = useParams();
  return (
    <div className="min-h-screen bg-slate-950">
      <RequireAuth roles={['therapist', 'supervisor']}>{() => <TableMode runId={runId} />}</RequireAuth>
    </div>
  );
}
