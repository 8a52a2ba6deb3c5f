import { Link } from 'react-router-dom';
import { AlertTriangle, CheckCircle2, Clock, OctagonAlert, Square } from 'lucide-react';
import type { RunDetailView } from '../../../../shared/runs/responses';
import type { RunStatus } from '../../../../shared/runs/log-entry';
import { redFlagStopAdvice, stopElevateReferAdvice } from '../../../../shared/runs/stop-advice';

const endings: Partial<Record<RunStatus, { title: string; Icon: typeof CheckCircle2; tone: string }>> = {
  completed: { title: 'This run is complete', Icon: CheckCircle2, tone: 'text-emerald-300' },
  'fell-back': { title: 'This run went back to cold and has ended', Icon: AlertTriangle, tone: 'text-amber-300' },
  'stopped-referred': { title: 'This run was stopped — refer to a physician', Icon: OctagonAlert, tone: 'text-red-300' },
  'ended-early': { title: 'This run was ended early', Icon: Square, tone: 'text-slate-200' },
  abandoned: { title: 'This run was closed after a long time with no activity', Icon: Clock, tone: 'text-slate-200' },
};

/**
 * What table mode shows for a run the server has finished: its ending and the way to its summary, never a live
 * step, whatever this tablet still holds for it.
 */
export function FinishedRun({ detail }: { detail: RunDetailView }) {
  const { run } = detail;
  const ending = endings[run.status] ?? endings.completed!;
  const advice = run.status === 'stopped-referred' ? redFlagStopAdvice : run.outcome === 'stop-elevate-refer' ? stopElevateReferAdvice : null;
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-6 bg-slate-950 px-6 text-center font-sans text-paper" data-testid="finished-run">
      <ending.Icon aria-hidden className={`h-24 w-24 ${ending.tone}`} />
      <h1 className={`text-5xl font-bold ${ending.tone}`}>{ending.title}</h1>
      <p className="text-2xl text-slate-300">
        {run.athleteName} · <span className="capitalize">{run.injuryLabel}</span>
      </p>
      {advice ? <p className="max-w-2xl text-2xl text-slate-200">{advice}</p> : null}
      <p className="max-w-2xl text-xl text-slate-400">A finished run cannot be run again. To treat again, start a new run from the injury.</p>
      <div className="flex flex-wrap justify-center gap-4">
        <Link to={`/runs/${run.id}/summary`} className="flex min-h-table-target items-center rounded-2xl bg-paper px-8 text-2xl font-semibold text-slate-950">
          See the summary
        </Link>
        <Link to={`/injuries/${run.injuryId}`} className="flex min-h-table-target items-center rounded-2xl px-8 text-2xl ring-1 ring-slate-600">
          Back to the injury
        </Link>
      </div>
    </main>
  );
}
