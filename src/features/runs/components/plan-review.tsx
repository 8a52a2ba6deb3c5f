import type { Plan } from '../../../../shared/plan/build-plan';
import { Notice } from '../../../components/ui/notice';

export function formatDuration(seconds: number): string {
  const m = Math.floor(seconds / 60);
  const s = seconds % 60;
  return s === 0 ? `${m} min` : `${m} min ${s} s`;
}

/** The plan the run will follow, read before table mode starts. */
export function PlanReview({ plan }: { plan: Plan }) {
  const total = plan.steps.reduce((sum, step) => sum + step.seconds, 0);
  return (
    <section aria-labelledby="plan-heading" className="flex flex-col gap-3">
      <h2 id="plan-heading" className="text-xl font-semibold">
        The plan — {plan.steps.length} steps, about {Math.round(total / 60)} minutes
      </h2>
      {plan.cautions.map((caution) => (
        <Notice key={caution} kind="caution">
          {caution}
        </Notice>
      ))}
      <ol className="divide-y divide-ink/10 rounded-xl bg-paper-raised ring-1 ring-ink/10">
        {plan.steps.map((step) => (
          <li key={step.index} className="flex items-start justify-between gap-4 px-4 py-3">
            <div>
              <p className="font-medium">
                {step.index + 1}. {step.label}
                {step.optional ? <span className="ml-2 text-sm font-normal text-ink-muted">(optional)</span> : null}
              </p>
              <p className="text-sm text-ink-muted">{step.cue}</p>
            </div>
            <p className="shrink-0 text-right font-medium tabular-nums">
              {formatDuration(step.seconds)}
              {step.needsConfirm ? <span className="block text-xs font-normal text-ink-muted">waits for you</span> : null}
            </p>
          </li>
        ))}
      </ol>
      <p className="text-sm text-ink-muted">
        If swelling increases during the run: {plan.backToCold === 'cold-and-compression' ? 'back to cold and compression.' : 'stop, elevate and refer (cold is contraindicated).'}
      </p>
    </section>
  );
}
