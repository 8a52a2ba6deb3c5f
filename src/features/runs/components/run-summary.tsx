import type { RunDetailView } from '../../../../shared/runs/responses';
import { formatDuration } from './plan-review';

const outcomeWords: Record<string, string> = {
  completed: 'Completed',
  'fell-back': 'Fell back to cold',
  'stop-elevate-refer': 'Stop, elevate and refer',
  'stopped-referred': 'Stopped and referred',
  'ended-early': 'Ended early',
};

const entryWords: Record<string, string> = {
  'step-completed': 'Completed',
  'step-skipped': 'Skipped',
  'step-interrupted': 'Interrupted',
  'swelling-check': 'Swelling check',
  paused: 'Paused',
  resumed: 'Resumed',
  extended: 'Extended',
  'red-flag': 'Red flag',
  'run-completed': 'Run completed',
  'run-fell-back': 'Back to cold — run ended',
  'run-ended-early': 'Run ended early',
};

const time = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit', second: '2-digit' });

/** What was done at the table, step by step, planned against actual. */
export function RunSummary({ detail }: { detail: RunDetailView }) {
  const { run, entries } = detail;
  const steps = entries.filter((e) => e.type.startsWith('step-'));
  const checks = entries.filter((e) => e.type === 'swelling-check');
  return (
    <div className="flex flex-col gap-4">
      <dl className="grid gap-3 sm:grid-cols-4">
        <div className="rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
          <dt className="text-sm text-ink-muted">Outcome</dt>
          <dd className="text-lg font-semibold">{run.outcome ? outcomeWords[run.outcome] : run.status}</dd>
        </div>
        <div className="rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
          <dt className="text-sm text-ink-muted">Steps done</dt>
          <dd className="text-lg font-semibold">
            {steps.filter((e) => e.type === 'step-completed').length} of {run.plan.steps.length}
          </dd>
        </div>
        <div className="rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
          <dt className="text-sm text-ink-muted">Swelling checks</dt>
          <dd className="text-lg font-semibold">{checks.length ? checks.map((c) => c.detail).join(', ') : 'none'}</dd>
        </div>
        <div className="rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
          <dt className="text-sm text-ink-muted">Started – ended</dt>
          <dd className="text-lg font-semibold">
            {run.startedAt ? time(run.startedAt) : '—'} – {run.endedAt ? time(run.endedAt) : '—'}
          </dd>
        </div>
      </dl>
      <table className="w-full overflow-hidden rounded-xl bg-paper-raised text-left ring-1 ring-ink/10">
        <caption className="sr-only">Every log entry of the run in order</caption>
        <thead className="bg-paper-sunk text-sm">
          <tr>
            <th scope="col" className="px-4 py-2">Time</th>
            <th scope="col" className="px-4 py-2">Entry</th>
            <th scope="col" className="px-4 py-2">Step</th>
            <th scope="col" className="px-4 py-2">Planned</th>
            <th scope="col" className="px-4 py-2">Actual</th>
            <th scope="col" className="px-4 py-2">Reason or detail</th>
          </tr>
        </thead>
        <tbody>
          {entries.map((entry) => (
            <tr key={entry.id} className="border-t border-ink/10">
              <td className="px-4 py-2 tabular-nums">{time(entry.at)}</td>
              <td className="px-4 py-2 font-medium">{entryWords[entry.type] ?? entry.type}</td>
              <td className="px-4 py-2">{entry.stepIndex !== null ? `${entry.stepIndex + 1}. ` : ''}{entry.kind?.replace(/-/g, ' ') ?? ''}</td>
              <td className="px-4 py-2 tabular-nums">{entry.plannedSeconds !== null ? formatDuration(entry.plannedSeconds) : ''}</td>
              <td className="px-4 py-2 tabular-nums">{entry.actualSeconds !== null ? formatDuration(entry.actualSeconds) : ''}</td>
              <td className="px-4 py-2">{entry.reason ?? entry.detail ?? ''}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
