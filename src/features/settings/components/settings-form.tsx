import { useId, useMemo, useState, type ReactNode } from 'react';
import { useForm, type FieldPath } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CheckCircle2, Save } from 'lucide-react';
import {
  clinicSettingLabels,
  coldProtocolLabels,
  coldProtocols,
  settingsBodySchema,
  type ClinicSettings,
  type SettingsBody,
  type SettingsBodyInput,
  type SettingsView,
} from '../../../../shared/clinic/settings';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { useSaveSettings } from '../api/save-settings';
import { useSettings } from '../api/get-settings';

const blankToNull = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? null : value);
const phaseWords = { acute: 'Acute', proliferative: 'Proliferative', remodelling: 'Remodelling' } as const;

function defaultText(key: keyof ClinicSettings, view: SettingsView): string {
  const value = view.defaults[key];
  const shown =
    value === null
      ? 'none'
      : key === 'wakingHours'
        ? `${view.defaults.wakingHours.start}–${view.defaults.wakingHours.end}`
        : key === 'coldProtocol'
          ? coldProtocolLabels[view.defaults.coldProtocol]
          : key === 'recheckIntervalHours'
            ? `${view.defaults.recheckIntervalHours.acute} / ${view.defaults.recheckIntervalHours.proliferative} / ${view.defaults.recheckIntervalHours.remodelling} h`
            : String(value);
  return `Default: ${shown} — ${view.sources[key]}`;
}

function Group({ title, children, hint }: { title: string; children: ReactNode; hint?: string }) {
  return (
    <fieldset className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <legend className="px-1 text-lg font-semibold">{title}</legend>
      {hint ? <p className="text-sm text-ink-muted">{hint}</p> : null}
      {children}
    </fieldset>
  );
}

export function ClinicSettingsScreen() {
  const settings = useSettings();
  const [saved, setSaved] = useState(false);
  if (settings.isPending) return <p className="text-ink-muted">Loading the clinic&rsquo;s settings…</p>;
  if (settings.isError) return <p className="text-ember-700">{settings.error.message}</p>;
  // Keyed by the saved time: after a save the form starts again from what the server stored.
  return <SettingsForm key={settings.data.updatedAt} view={settings.data} saved={saved} onSavedChange={setSaved} />;
}

function toValues(view: SettingsView): SettingsBodyInput {
  const { settings } = view;
  return { clinicName: view.clinicName, ...settings, wakingHours: { ...settings.wakingHours }, recheckIntervalHours: { ...settings.recheckIntervalHours } };
}

function SettingsForm({ view, saved, onSavedChange: setSaved }: { view: SettingsView; saved: boolean; onSavedChange: (saved: boolean) => void }) {
  const save = useSaveSettings();
  const zoneListId = useId();
  // Chromium and Safari list every IANA zone they know; the server checks the name either way.
  const zones = useMemo(() => (typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : []), []);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<SettingsBodyInput, unknown, SettingsBody>({ resolver: zodResolver(settingsBodySchema), defaultValues: toValues(view) });

  const onSubmit = handleSubmit((values) =>
    save.mutateAsync(values).then(
      () => setSaved(true),
      (error: unknown) => {
        setSaved(false);
        const fields = error instanceof ApiError ? (error.fields ?? {}) : {};
        for (const [name, message] of Object.entries(fields)) setError(name as FieldPath<SettingsBodyInput>, { type: 'server', message });
        if (!Object.keys(fields).length) setError('root.server', { type: 'server', message: error instanceof ApiError ? error.message : 'Could not reach Mendstep. Try again.' });
      },
    ),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Clinic settings" className="flex flex-col gap-4" onChange={() => setSaved(false)}>
      <Notice kind="info" title="Changes apply to runs started from now on">
        A run already planned keeps the plan it was built with, so nobody&rsquo;s treatment changes half-way. Every change is kept in the audit trail.
      </Notice>
      {errors.root?.server ? (
        <Notice kind="error" title="Not saved">
          {errors.root.server.message}
        </Notice>
      ) : null}

      <Group title="Clinic">
        <div className="grid gap-4 md:grid-cols-3">
          <TextField label="Clinic name" hint="Shown to staff and in e-mails to athletes" error={errors.clinicName?.message} {...register('clinicName')} />
          <TextField label={clinicSettingLabels.contactEmail} type="email" hint="Optional; printed on e-mails and referral summaries" error={errors.contactEmail?.message} {...register('contactEmail', { setValueAs: blankToNull })} />
          <TextField label={clinicSettingLabels.contactPhone} type="tel" hint="Optional" error={errors.contactPhone?.message} {...register('contactPhone', { setValueAs: blankToNull })} />
        </div>
      </Group>

      <Group title="Time and cold" hint="Cold schedules and reminders are computed in the clinic's time zone, inside the athlete's waking hours.">
        <div className="grid gap-4 md:grid-cols-3">
          <div>
            <TextField label={clinicSettingLabels.timeZone} list={zoneListId} autoComplete="off" hint={defaultText('timeZone', view)} error={errors.timeZone?.message} {...register('timeZone')} />
            <datalist id={zoneListId}>
              {zones.map((zone) => (
                <option key={zone} value={zone} />
              ))}
            </datalist>
          </div>
          <TextField label="Waking hours start" type="time" hint={defaultText('wakingHours', view)} error={errors.wakingHours?.start?.message} {...register('wakingHours.start')} />
          <TextField label="Waking hours end" type="time" error={errors.wakingHours?.end?.message} {...register('wakingHours.end')} />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="cold-protocol" className="text-sm font-medium">
            {clinicSettingLabels.coldProtocol}
          </label>
          <select id="cold-protocol" className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2" aria-describedby="cold-protocol-hint" {...register('coldProtocol')}>
            {coldProtocols.map((protocol) => (
              <option key={protocol} value={protocol}>
                {coldProtocolLabels[protocol]}
              </option>
            ))}
          </select>
          <p id="cold-protocol-hint" className="text-sm text-ink-muted">
            {defaultText('coldProtocol', view)}
          </p>
        </div>
        <div className="grid gap-4 md:grid-cols-3">
          <TextField
            label="Minimum interval between cold applications"
            unit="minutes"
            inputMode="numeric"
            hint={defaultText('minColdIntervalMinutes', view)}
            error={errors.minColdIntervalMinutes?.message}
            {...register('minColdIntervalMinutes', { valueAsNumber: true })}
          />
          <TextField
            label={clinicSettingLabels.swellingThresholdCm}
            unit="cm"
            inputMode="decimal"
            step="0.1"
            hint={defaultText('swellingThresholdCm', view)}
            error={errors.swellingThresholdCm?.message}
            {...register('swellingThresholdCm', { valueAsNumber: true })}
          />
          <TextField
            label={clinicSettingLabels.abandonAfterHours}
            unit="hours"
            inputMode="numeric"
            hint={defaultText('abandonAfterHours', view)}
            error={errors.abandonAfterHours?.message}
            {...register('abandonAfterHours', { valueAsNumber: true })}
          />
        </div>
        <Notice kind="caution" title="Cold can hurt">
          Over superficial nerves (the fibular head, the inner elbow) and where there is little fat, long cold applications have caused nerve palsies. Mendstep never schedules
          more than 20 minutes of continuous cold.
        </Notice>
      </Group>

      <Group title={clinicSettingLabels.recheckIntervalHours} hint={`Mendstep suggests the next re-check this long after each run; the therapist can move it. ${defaultText('recheckIntervalHours', view)}`}>
        <div className="grid gap-4 md:grid-cols-3">
          {(['acute', 'proliferative', 'remodelling'] as const).map((phase) => (
            <TextField
              key={phase}
              label={`${phaseWords[phase]} phase`}
              unit="hours"
              inputMode="numeric"
              error={errors.recheckIntervalHours?.[phase]?.message}
              {...register(`recheckIntervalHours.${phase}`, { valueAsNumber: true })}
            />
          ))}
        </div>
      </Group>

      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={isSubmitting || !isDirty}>
          <Save aria-hidden className="h-4 w-4" /> {isSubmitting ? 'Saving…' : 'Save settings'}
        </Button>
        {saved ? (
          <p role="status" className="flex items-center gap-2 font-medium">
            <CheckCircle2 aria-hidden className="h-5 w-5 text-moss-600" /> Saved. New runs use these settings.
          </p>
        ) : null}
      </div>
    </form>
  );
}
