import { useEffect, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { Timer } from 'lucide-react';
import type { RunInProgressView } from '../../../../shared/runs/run-progress';
import { getRunsInProgressQueryOptions } from '../api/run-queries';

const resumeClass = 'inline-flex min-h-target items-center justify-center gap-2 rounded-lg bg-ink px-4 py-2 font-medium text-paper hover:bg-ink-soft';

function useMinuteClock() {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 15_000);
    return () => clearInterval(timer);
  }, []);
  return now;
}

export function describeProgress(run: RunInProgressView, now: number): string {
  // Until the first step ends, the server has no entry to place the run by.
  if (run.stepIndex === null) return 'In table mode — no step finished yet';
  const step = `Step ${run.stepIndex + 1} of ${run.stepCount}: ${run.stepLabel}`;
  if (!run.stepEndsAt) return step;
  const minutesLeft = Math.round((Date.parse(run.stepEndsAt) - now) / 60_000);
  // From the server's log alone: pauses and extra minutes on the tablet are not known here, so the time is "about".
  return minutesLeft > 0 ? `${step} · about ${minutesLeft} min left` : `${step} · due to end`;
}

/**
 * Runs under way — on Today for the clinic, on the injury page for that injury — so a run left in table mode is
 * never out of sight while its timer goes on.
 */
export function RunsInProgress({ injuryId }: { injuryId?: string }) {
  const runs = useQuery(getRunsInProgressQueryOptions(injuryId));
  const now = useMinuteClock();
  if (!runs.data?.length) return null;
  return (
    <section aria-labelledby="runs-in-progress-heading" className="mb-6 rounded-xl border-2 border-ink/70 bg-paper-raised p-4" data-testid="runs-in-progress">
      <h2 id="runs-in-progress-heading" className="flex items-center gap-2 text-lg font-semibold">
        <Timer aria-hidden className="h-5 w-5" /> {injuryId ? 'A run is in progress' : 'Runs in progress'}
      </h2>
      <ul className="mt-2 divide-y divide-ink/10">
        {runs.data.map((run) => (
          <li key={run.runId} className="flex flex-wrap items-center justify-between gap-3 py-2">
            <div>
              <p className="font-medium">
                {run.athleteName} · {run.injuryLabel}
              </p>
              <p className="text-sm text-ink-muted">
                {describeProgress(run, now)} · {run.therapistName}
              </p>
            </div>
            <Link to={`/table/${run.runId}`} className={resumeClass} aria-label={`Resume the run for ${run.athleteName}, ${run.injuryLabel}`}>
              Resume
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
