import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  coldContraindications,
  massageCautions,
  redFlags,
  screeningSchema,
  type Screening,
  type ScreeningInput,
} from '../../../../shared/runs/screening';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';

type Item = { id: string; label: string; source: string };

function CheckboxGroup({ legend, name, items, register, hint }: { legend: string; name: 'redFlags' | 'coldContraindications' | 'massageCautions'; items: readonly Item[]; register: ReturnType<typeof useForm<ScreeningInput, unknown, Screening>>['register']; hint: string }) {
  return (
    <fieldset className="rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <legend className="px-1 text-lg font-semibold">{legend}</legend>
      <p className="mb-2 text-sm text-ink-muted">{hint}</p>
      <div className="grid gap-1 sm:grid-cols-2">
        {items.map((item) => (
          <label key={item.id} className="flex min-h-target cursor-pointer items-center gap-3 rounded-lg px-2 hover:bg-paper-sunk">
            <input type="checkbox" value={item.id} className="h-6 w-6 accent-ink" {...register(name)} />
            <span>{item.label}</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** Screening before every run: red flags stop it, cautions change the plan and are acknowledged. */
export function ScreeningForm({ onSubmit, pending, error }: { onSubmit: (values: Screening) => void; pending: boolean; error: unknown }) {
  const form = useForm<ScreeningInput, unknown, Screening>({
    resolver: zodResolver(screeningSchema),
    defaultValues: { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false },
  });
  const { register, handleSubmit, control, formState } = form;
  const [flags, cold, massage] = useWatch({ control, name: ['redFlags', 'coldContraindications', 'massageCautions'] });
  const anyFlag = (flags?.length ?? 0) > 0;
  const anyCaution = (cold?.length ?? 0) + (massage?.length ?? 0) > 0;

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="flex flex-col gap-4" aria-label="Screening">
      {error instanceof ApiError ? <Notice kind="error">{error.message}</Notice> : null}
      <CheckboxGroup legend="Red flags" name="redFlags" items={redFlags} register={register} hint="Any one of these: do not treat. Stop and refer to a physician at once." />
      {anyFlag ? (
        <Notice kind="error" title="Stop and refer">
          A red flag is ticked. Saving the screening records the run as stopped and referred; refer the athlete to a physician now.
        </Notice>
      ) : null}
      <CheckboxGroup legend="Cold contraindications" name="coldContraindications" items={coldContraindications} hint="Cold and ice massage are left out of the plan." register={register} />
      <CheckboxGroup legend="Massage cautions" name="massageCautions" items={massageCautions} hint="Work lightly or not at all over the site; warmth and firmness take friction and stripping out." register={register} />
      <fieldset className="rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
        <legend className="px-1 text-lg font-semibold">Athlete's tolerance today</legend>
        <div className="flex flex-wrap gap-4">
          {(['usual', 'light'] as const).map((value) => (
            <label key={value} className="flex min-h-target cursor-pointer items-center gap-3 rounded-lg px-2 hover:bg-paper-sunk">
              <input type="radio" value={value} className="h-6 w-6 accent-ink" {...register('tolerance')} />
              <span>{value === 'usual' ? 'Usual' : 'Light — shorter hands-on steps'}</span>
            </label>
          ))}
        </div>
      </fieldset>
      {anyCaution ? (
        <label className="flex min-h-target items-center gap-3 rounded-lg bg-ember-50 px-3">
          <input type="checkbox" className="h-6 w-6 accent-ink" {...register('cautionsAcknowledged')} />
          <span className="font-medium">I have read the cautions and adjusted my work to them.</span>
        </label>
      ) : null}
      {formState.errors.cautionsAcknowledged ? (
        <p role="alert" className="font-medium text-ember-700">
          {formState.errors.cautionsAcknowledged.message}
        </p>
      ) : null}
      <Button type="submit" variant={anyFlag ? 'danger' : 'primary'} disabled={pending} className="self-start">
        {anyFlag ? 'Record stop and refer' : 'Save screening and review the plan'}
      </Button>
    </form>
  );
}
