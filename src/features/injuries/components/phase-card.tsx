import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Calculator, Check, Hand, Layers } from 'lucide-react';
import { phases } from '../../../../shared/phase';
import { phaseOverrideSchema, type PhaseOverride } from '../../../../shared/records/injury';
import type { InjuryView } from '../../../../shared/records/responses';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useSetPhaseOverride } from '../api/set-phase-override';
import { formWideError, showServerErrors } from '../lib/form';
import { formatDateTime } from '../lib/time';
import { Card } from './card';
import { TextAreaField } from './fields';
import { PhaseBadge, phaseDisplay } from './phase-badge';

export function PhaseCard({ injury }: { injury: InjuryView }) {
  const [editing, setEditing] = useState(false);
  const clear = useSetPhaseOverride(injury.id);
  const override = injury.phaseOverride;

  return (
    <Card title="Phase of healing" icon={Layers}>
      <div className="flex flex-wrap items-center gap-3">
        <PhaseBadge phase={injury.phase} size="lg" />
        {injury.phaseIsOverride ? (
          <span className="inline-flex items-center gap-1 rounded-md bg-ember-50 px-2 py-0.5 text-sm font-semibold text-ember-700">
            <Hand aria-hidden className="h-4 w-4" /> Override
          </span>
        ) : (
          <span className="inline-flex items-center gap-1 rounded-md bg-tide-50 px-2 py-0.5 text-sm font-semibold text-tide-700">
            <Calculator aria-hidden className="h-4 w-4" /> Suggested
          </span>
        )}
      </div>
      <p data-testid="phase-reason">{injury.phaseReason}</p>
      {override ? (
        <div className="rounded-lg bg-paper-sunk p-3 text-sm">
          <p>
            Set {override.byName ? `by ${override.byName} ` : ''}on {formatDateTime(override.at)}.
          </p>
          <p className="mt-1 flex flex-wrap items-center gap-2">
            Suggested from time and signs: <PhaseBadge phase={injury.suggestedPhase} />
          </p>
          <p className="mt-1 text-ink-muted">{injury.assessment.suggestedPhaseReason}</p>
        </div>
      ) : null}
      {clear.isError ? (
        <Notice kind="error" title="Override not cleared">
          {clear.error.message}
        </Notice>
      ) : null}
      {editing ? (
        <PhaseOverrideForm injury={injury} onDone={() => setEditing(false)} />
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setEditing(true)}>
            <Hand aria-hidden className="h-4 w-4" /> {override ? 'Change the override' : 'Override the phase'}
          </Button>
          {override ? (
            <Button variant="ghost" disabled={clear.isPending} onClick={() => clear.mutate(null)}>
              {clear.isPending ? 'Clearing…' : 'Clear override'}
            </Button>
          ) : null}
        </div>
      )}
    </Card>
  );
}

const fieldNames = ['phase', 'reason'] as const;

export function PhaseOverrideForm({ injury, onDone }: { injury: InjuryView; onDone: () => void }) {
  const setOverride = useSetPhaseOverride(injury.id);
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors },
  } = useForm<PhaseOverride>({
    resolver: zodResolver(phaseOverrideSchema),
    defaultValues: { phase: injury.phaseOverride?.phase ?? injury.phase, reason: '' },
  });

  const onSubmit = handleSubmit((values) =>
    setOverride.mutateAsync(values).then(onDone, (error) => showServerErrors<PhaseOverride>(error, fieldNames, setError)),
  );
  const formError = formWideError(errors);
  const chosen = watch('phase');

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Override the phase" className="flex flex-col gap-3 rounded-lg border border-ink/15 p-3">
      {formError ? (
        <Notice kind="error" title="Override not saved">
          {formError}
        </Notice>
      ) : null}
      <fieldset>
        <legend className="mb-1 text-sm font-medium">Phase to use</legend>
        <div className="flex flex-wrap gap-2">
          {phases.map((phase) => {
            const { word, Icon } = phaseDisplay[phase];
            return (
              <label
                key={phase}
                className="inline-flex min-h-target cursor-pointer items-center gap-2 rounded-lg border border-ink/30 bg-paper-raised px-3 font-medium has-[:checked]:border-ink has-[:checked]:bg-ink has-[:checked]:text-paper has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-tide-500"
              >
                <input type="radio" value={phase} className="sr-only" {...register('phase')} />
                {chosen === phase ? <Check aria-hidden className="h-4 w-4" /> : <Icon aria-hidden className="h-4 w-4" />}
                {word}
              </label>
            );
          })}
        </div>
        {errors.phase ? (
          <p role="alert" className="mt-1 text-sm font-medium text-ember-700">
            {errors.phase.message}
          </p>
        ) : null}
      </fieldset>
      <TextAreaField
        label="Reason for the override"
        hint="At least 5 characters; the review desk sees it."
        error={errors.reason?.message}
        {...register('reason')}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={setOverride.isPending}>
          {setOverride.isPending ? 'Saving…' : 'Save override'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
