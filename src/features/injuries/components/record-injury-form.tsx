import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { haematomaTypes, injuryCreateSchema, mechanismKinds, type HaematomaType, type InjuryCreate, type MechanismKind } from '../../../../shared/records/injury';
import type { BodyRegionId, Side } from '../../../../shared/records/body-map';
import type { InjuryView } from '../../../../shared/records/responses';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { useCreateInjury } from '../api/create-injury';
import { convertingResolver, formWideError, showServerErrors } from '../lib/form';
import { localInputToIso, toLocalInputValue } from '../lib/time';
import { BodyMapPicker } from './body-map-picker';
import { CheckboxField, SelectField, TextAreaField } from './fields';

export const mechanismWords: Record<MechanismKind, string> = {
  'knee-to-thigh': 'Knee to thigh',
  ball: 'Ball',
  'stick-or-bat': 'Stick or bat',
  fall: 'Fall',
  collision: 'Collision',
  other: 'Other',
};

export const haematomaWords: Record<HaematomaType, string> = {
  intramuscular: 'Intramuscular',
  intermuscular: 'Intermuscular',
  'not-known': 'Not known yet',
};

interface RecordInjuryValues {
  region: BodyRegionId | '';
  side: Side | '';
  mechanismKind: MechanismKind | '';
  mechanism: string;
  injuredAt: string;
  haematomaType: HaematomaType;
  previousQuadricepsInjury: boolean;
  kneeEffusion: boolean;
}

const fieldNames = ['region', 'side', 'mechanismKind', 'mechanism', 'injuredAt', 'haematomaType', 'previousQuadricepsInjury', 'kneeEffusion'] as const;

export function RecordInjuryForm({ athleteId, onRecorded, onCancel }: { athleteId: string; onRecorded: (injury: InjuryView) => void; onCancel?: () => void }) {
  const createInjury = useCreateInjury();
  const mapErrorId = useId();
  const {
    register,
    handleSubmit,
    setValue,
    watch,
    setError,
    formState: { errors, isSubmitted },
  } = useForm<RecordInjuryValues, unknown, InjuryCreate>({
    resolver: convertingResolver(
      injuryCreateSchema,
      (values: RecordInjuryValues) => ({
        athleteId,
        region: values.region || undefined,
        side: values.side || undefined,
        mechanismKind: values.mechanismKind || undefined,
        mechanism: values.mechanism.trim() === '' ? undefined : values.mechanism,
        injuredAt: localInputToIso(values.injuredAt),
        haematomaType: values.haematomaType,
        previousQuadricepsInjury: values.previousQuadricepsInjury,
        kneeEffusion: values.kneeEffusion,
      }) as never,
      {
        region: 'Choose the injury site on the body map or in the list',
        side: 'Choose the side',
        mechanismKind: 'Choose how the injury happened',
        injuredAt: 'Enter the date and time of the injury',
      },
    ),
    defaultValues: {
      region: '',
      side: '',
      mechanismKind: '',
      mechanism: '',
      injuredAt: '',
      haematomaType: 'not-known',
      previousQuadricepsInjury: false,
      kneeEffusion: false,
    },
  });

  const region = watch('region');
  const side = watch('side');
  const site = region && side ? { region, side } : null;

  const onSubmit = handleSubmit((values) =>
    createInjury.mutate(values, {
      onSuccess: (injury) => onRecorded(injury),
      onError: (error) => showServerErrors<RecordInjuryValues>(error, fieldNames, setError),
    }),
  );

  const siteError = errors.region?.message ?? errors.side?.message;
  const formError = formWideError(errors);

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Record an injury" className="flex flex-col gap-4">
      {formError ? (
        <Notice kind="error" title="Injury not recorded">
          {formError}
        </Notice>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-[auto_1fr]">
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-2 text-base font-semibold">Where is the contusion?</legend>
          <BodyMapPicker
            value={site}
            errorId={mapErrorId}
            error={siteError}
            onChange={(next) => {
              setValue('region', next.region, { shouldValidate: isSubmitted, shouldDirty: true });
              setValue('side', next.side, { shouldValidate: isSubmitted, shouldDirty: true });
            }}
          />
          {siteError ? (
            <p id={mapErrorId} role="alert" className="text-sm font-medium text-ember-700">
              {siteError}
            </p>
          ) : null}
        </fieldset>
        <div className="flex flex-col gap-4">
          <SelectField label="Mechanism" error={errors.mechanismKind?.message} {...register('mechanismKind')}>
            <option value="" disabled>
              Choose how it happened
            </option>
            {mechanismKinds.map((kind) => (
              <option key={kind} value={kind}>
                {mechanismWords[kind]}
              </option>
            ))}
          </SelectField>
          <TextAreaField label="How it happened" hint="In your words, e.g. knee from an opponent in a tackle" error={errors.mechanism?.message} {...register('mechanism')} />
          <TextField
            label="Date and time of injury"
            type="datetime-local"
            max={toLocalInputValue(new Date())}
            hint="Local time on this tablet"
            error={errors.injuredAt?.message}
            {...register('injuredAt')}
          />
          <SelectField label="Haematoma type" hint="Suspected; change it later if the picture changes" error={errors.haematomaType?.message} {...register('haematomaType')}>
            {haematomaTypes.map((type) => (
              <option key={type} value={type}>
                {haematomaWords[type]}
              </option>
            ))}
          </SelectField>
          <div className="flex flex-col">
            <CheckboxField label="Previous quadriceps injury" {...register('previousQuadricepsInjury')} />
            <CheckboxField label="Knee effusion" {...register('kneeEffusion')} />
          </div>
          <div className="flex flex-wrap gap-3">
            <Button type="submit" disabled={createInjury.isPending}>
              {createInjury.isPending ? 'Recording…' : 'Record injury'}
            </Button>
            {onCancel ? (
              <Button variant="secondary" onClick={onCancel}>
                Cancel
              </Button>
            ) : null}
          </div>
        </div>
      </div>
    </form>
  );
}
