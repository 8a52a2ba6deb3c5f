import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { athleteCreateSchema, type AthleteCreate, type AthleteCreateInput } from '../../../../shared/records/athlete';
import type { AthleteView } from '../../../../shared/records/responses';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';

const blankToNull = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? null : value);
const fieldNames = ['name', 'yearOfBirth', 'sport', 'position', 'email', 'notes', 'consentToTreatment'] as const;

/**
 * Registering and editing share one form. Editing sends every field, so the create schema's required fields
 * are the right check there too; consent has its own confirmed toggle once the athlete exists.
 */
export function AthleteForm({
  athlete,
  submitLabel,
  onSave,
  onCancel,
}: {
  athlete?: AthleteView;
  submitLabel: string;
  onSave: (values: AthleteCreate) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const notesId = useId();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<AthleteCreateInput, unknown, AthleteCreate>({
    resolver: zodResolver(athleteCreateSchema),
    defaultValues: athlete
      ? { name: athlete.name, yearOfBirth: athlete.yearOfBirth, sport: athlete.sport, position: athlete.position, email: athlete.email, notes: athlete.notes }
      : { name: '', sport: '', position: null, email: null, notes: null, consentToTreatment: false },
  });

  const onSubmit = handleSubmit((values) =>
    onSave(athlete ? { ...values, consentToTreatment: undefined } : values).catch((error: unknown) => {
      // The server's 400 names fields: show each beside its input, anything else above the form.
      const fields = error instanceof ApiError ? (error.fields ?? {}) : {};
      const known = Object.entries(fields).filter(([name]) => (fieldNames as readonly string[]).includes(name));
      for (const [name, message] of known) setError(name as (typeof fieldNames)[number], { type: 'server', message });
      if (!known.length) setError('root.server', { type: 'server', message: error instanceof ApiError ? error.message : 'Could not reach Mendstep. Try again.' });
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label={athlete ? 'Edit athlete' : 'Add athlete'} className="flex flex-col gap-4">
      {errors.root?.server ? (
        <Notice kind="error" title="Not saved">
          {errors.root.server.message}
        </Notice>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <TextField label="Name" autoComplete="off" error={errors.name?.message} {...register('name')} />
        <TextField label="Year of birth" inputMode="numeric" hint="Four digits, e.g. 2001" error={errors.yearOfBirth?.message} {...register('yearOfBirth', { valueAsNumber: true })} />
        <TextField label="Sport" hint="e.g. Football, Hockey" error={errors.sport?.message} {...register('sport')} />
        <TextField label="Position" hint="Optional" error={errors.position?.message} {...register('position', { setValueAs: blankToNull })} />
        <TextField label="E-mail" type="email" hint="Optional; for home-care e-mails" error={errors.email?.message} {...register('email', { setValueAs: blankToNull })} />
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={notesId} className="text-sm font-medium">
          Notes
        </label>
        <textarea
          id={notesId}
          rows={2}
          aria-invalid={errors.notes ? true : undefined}
          aria-describedby={errors.notes ? `${notesId}-error` : undefined}
          className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2"
          {...register('notes', { setValueAs: blankToNull })}
        />
        {errors.notes ? (
          <p id={`${notesId}-error`} role="alert" className="text-sm font-medium text-ember-700">
            {errors.notes.message}
          </p>
        ) : null}
      </div>
      {athlete ? null : (
        <label className="inline-flex min-h-target cursor-pointer items-center gap-3 self-start font-medium">
          <input type="checkbox" className="h-6 w-6 accent-ink" {...register('consentToTreatment')} />
          The athlete consents to treatment (recorded with your name and the time)
        </label>
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
