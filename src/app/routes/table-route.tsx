import { useNavigate, useParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { useRun } from '../../features/runs/api/run-queries';
import { TableModeScreen } from '../../features/table-mode/components/table-mode-screen';

function TableMode({ runId }: { runId: string }) {
  const run = useRun(runId);
  const navigate = useNavigate();
  if (run.isPending) return <p className="p-8 text-2xl text-slate-300">Loading the run…</p>;
  if (run.isError) return <p className="p-8 text-2xl text-red-300">{run.error.message}</p>;
  if (run.data.run.status === 'screening') {
    navigate(`/runs/${runId}/screening`, { replace: true });
    return null;
  }
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
