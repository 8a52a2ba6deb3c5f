import { Link, useParams } from 'react-router-dom';
import { OctagonAlert, Play } from 'lucide-react';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { useRun, useSubmitScreening } from '../../features/runs/api/run-queries';
import { PhaseBadge } from '../../features/runs/components/phase-badge';
import { PlanReview } from '../../features/runs/components/plan-review';
import { ScreeningForm } from '../../features/runs/components/screening-form';
import { AppShell } from '../layout/app-shell';

function Screening({ runId }: { runId: string }) {
  const run = useRun(runId);
  const submit = useSubmitScreening(runId);
  if (run.isPending) return <p className="text-ink-muted">Loading the run…</p>;
  if (run.isError) return <p className="text-ember-700">{run.error.message}</p>;
  const view = run.data.run;

  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold">Screening — {view.athleteName}</h1>
        <PhaseBadge phase={view.phase} />
        <span className="text-ink-muted">{view.injuryLabel}</span>
      </header>
      {view.status === 'screening' ? (
        <ScreeningForm onSubmit={(values) => submit.mutate(values)} pending={submit.isPending} error={submit.error} />
      ) : view.status === 'stopped-referred' ? (
        <section role="alert" className="flex flex-col gap-3 rounded-xl border-l-8 border-ember-700 bg-ember-50 p-6">
          <h2 className="flex items-center gap-2 text-2xl font-bold text-ember-700">
            <OctagonAlert aria-hidden className="h-8 w-8" /> Stop and refer
          </h2>
          <p className="text-lg">{view.message ?? 'A red flag was found. Do not treat; refer the athlete to a physician now.'}</p>
          <p>The run is recorded as stopped and referred, and your supervisor can see it on the review desk.</p>
          <Link to={`/injuries/${view.injuryId}/referral?runId=${view.id}`} className="inline-flex min-h-target items-center self-start rounded-lg bg-ink px-4 font-medium text-paper">
            Referral summary for the physician
          </Link>
          <Link to={`/injuries/${view.injuryId}`} className="underline">
            Back to the injury
          </Link>
        </section>
      ) : (
        <>
          <PlanReview plan={view.plan} />
          <div className="flex flex-wrap gap-3">
            <Link to={`/table/${view.id}`} className="inline-flex min-h-table-target items-center gap-2 rounded-xl bg-ink px-6 text-lg font-semibold text-paper">
              <Play aria-hidden className="h-6 w-6" /> Open table mode
            </Link>
            <Link to={`/injuries/${view.injuryId}`} className="inline-flex min-h-table-target items-center px-4 underline">
              Back to the injury
            </Link>
          </div>
        </>
      )}
    </div>
  );
}

export function ScreeningRoute() {
  const { id = '' } = useParams();
  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <Screening runId={id} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
