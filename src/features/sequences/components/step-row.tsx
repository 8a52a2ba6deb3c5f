import { useId } from 'react';
import { ArrowDown, ArrowUp, Trash2 } from 'lucide-react';
import { stepKindInfo } from '../../../../shared/plan/step-kinds';
import type { DraftStep } from '../lib/draft';

export type StepAction = 'up' | 'down' | 'remove';

export const formatDuration = (seconds: number) => {
  const m = Math.floor(seconds / 60);
  const s = seconds % 60;
  if (m === 0) return `${s} s`;
  return s ? `${m} min ${s} s` : `${m} min`;
};

export const boundsText = (step: Pick<DraftStep, 'kind'>) => {
  const { min, max } = stepKindInfo[step.kind].bounds;
  return `${formatDuration(min)} – ${formatDuration(max)}`;
};

const iconButton = 'inline-flex min-h-target min-w-target items-center justify-center rounded-lg border border-ink/25 bg-paper-raised hover:bg-paper-sunk disabled:cursor-not-allowed disabled:opacity-40';

type Props = {
  step: DraftStep;
  position: number;
  count: number;
  error?: string;
  kindError?: string;
  onChange: (patch: Partial<DraftStep>) => void;
  onAction: (action: StepAction) => void;
  buttonRef: (action: StepAction, element: HTMLButtonElement | null) => void;
};

/** One step: its kind, its duration in minutes and seconds with the kind's bounds beside it, optional, and moves. */
export function StepRow({ step, position, count, error, kindError, onChange, onAction, buttonRef }: Props) {
  const id = useId();
  const info = stepKindInfo[step.kind];
  const name = `step ${position + 1} (${info.label})`;
  const invalid = error ? true : undefined;
  const box = `min-h-target w-20 rounded-lg border bg-paper-raised px-3 py-2 text-base tabular-nums ${error ? 'border-ember-600' : 'border-ink/30'}`;

  return (
    <li className={`grid gap-3 rounded-xl bg-paper-raised p-3 ring-1 md:grid-cols-[2.5rem_minmax(0,1fr)_auto_auto] md:items-start ${error || kindError ? 'ring-ember-600' : 'ring-ink/10'}`} data-testid="sequence-step">
      <span className="pt-2 text-lg font-semibold tabular-nums text-ink-muted" aria-hidden>
        {position + 1}
      </span>
      <fieldset className="flex min-w-0 flex-col gap-1" aria-describedby={`${id}-bounds${error ? ` ${id}-error` : ''}`}>
        <legend className="font-semibold">
          <span className="sr-only">Step {position + 1}: </span>
          {info.label}
        </legend>
        {kindError ? (
          <p role="alert" className="text-sm font-medium text-ember-700">
            {kindError}
          </p>
        ) : null}
        <div className="flex flex-wrap items-end gap-3">
          <label className="flex flex-col gap-1 text-sm font-medium">
            Minutes
            <input className={box} inputMode="numeric" aria-invalid={invalid} value={step.minutes} onChange={(e) => onChange({ minutes: e.target.value })} />
          </label>
          <label className="flex flex-col gap-1 text-sm font-medium">
            Seconds
            <input className={box} inputMode="numeric" aria-invalid={invalid} value={step.seconds} onChange={(e) => onChange({ seconds: e.target.value })} />
          </label>
          <p id={`${id}-bounds`} className="pb-2 text-sm">
            <span className="font-medium">Allowed {boundsText(step)}</span>
            <span className="block text-xs text-ink-muted">Source: {info.boundsSource}</span>
          </p>
        </div>
        {error ? (
          <p id={`${id}-error`} role="alert" className="text-sm font-medium text-ember-700">
            {error}
          </p>
        ) : null}
      </fieldset>
      <label className="inline-flex min-h-target cursor-pointer items-center gap-2 font-medium">
        <input type="checkbox" className="h-6 w-6 accent-ink" checked={step.optional} onChange={(e) => onChange({ optional: e.target.checked })} />
        Optional
      </label>
      <div className="flex gap-2">
        <button type="button" ref={(el) => buttonRef('up', el)} className={iconButton} disabled={position === 0} aria-label={`Move ${name} up`} onClick={() => onAction('up')}>
          <ArrowUp aria-hidden className="h-5 w-5" />
        </button>
        <button type="button" ref={(el) => buttonRef('down', el)} className={iconButton} disabled={position === count - 1} aria-label={`Move ${name} down`} onClick={() => onAction('down')}>
          <ArrowDown aria-hidden className="h-5 w-5" />
        </button>
        <button type="button" ref={(el) => buttonRef('remove', el)} className={iconButton} disabled={count === 1} aria-label={`Remove ${name}`} onClick={() => onAction('remove')}>
          <Trash2 aria-hidden className="h-5 w-5" />
        </button>
      </div>
    </li>
  );
}
