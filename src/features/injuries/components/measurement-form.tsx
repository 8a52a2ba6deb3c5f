import { useForm } from 'react-hook-form';
import { measurementCreateSchema, type MeasurementCreate } from '../../../../shared/records/measurement';
import type { MeasurementView } from '../../../../shared/records/responses';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { useAddMeasurement } from '../api/add-measurement';
import { convertingResolver, formWideError, showServerErrors } from '../lib/form';
import { localInputToIso, toLocalInputValue } from '../lib/time';
import { TextAreaField } from './fields';

const numberFields = [
  'girthInjuredCm',
  'girthOtherCm',
  'girthDistanceCm',
  'kneeFlexionDeg',
  'painNprs',
  'bruiseLengthCm',
  'bruiseWidthCm',
  'skinfoldMm',
] as const;
type NumberField = (typeof numberFields)[number];

export type MeasurementFormValues = Record<NumberField, string> & { takenAt: string; girthLandmark: string; notes: string };

const fieldNames = [...numberFields, 'takenAt', 'girthLandmark', 'notes'] as const;

/** Empty boxes are "not measured"; a decimal comma is read as a point, as many therapists type it. */
function toNumber(text: string): number | null {
  const trimmed = text.trim();
  return trimmed === '' ? null : Number(trimmed.replace(',', '.'));
}

function toMeasurement(values: MeasurementFormValues) {
  const numbers = Object.fromEntries(numberFields.map((field) => [field, toNumber(values[field])]));
  return {
    ...numbers,
    takenAt: localInputToIso(values.takenAt),
    girthLandmark: values.girthLandmark.trim() === '' ? null : values.girthLandmark,
    notes: values.notes.trim() === '' ? null : values.notes,
  };
}

/** The girth site carries over from the last girth so that the next one is comparable with it. */
function emptyValues(previous: MeasurementView | undefined): MeasurementFormValues {
  return {
    takenAt: toLocalInputValue(new Date()),
    girthInjuredCm: '',
    girthOtherCm: '',
    girthLandmark: previous?.girthLandmark ?? '',
    girthDistanceCm: previous?.girthDistanceCm != null ? String(previous.girthDistanceCm) : '',
    kneeFlexionDeg: '',
    painNprs: '',
    bruiseLengthCm: '',
    bruiseWidthCm: '',
    skinfoldMm: '',
    notes: '',
  };
}

export function MeasurementForm({ injuryId, lastGirth }: { injuryId: string; lastGirth?: MeasurementView }) {
  const addMeasurement = useAddMeasurement(injuryId);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm<MeasurementFormValues, unknown, MeasurementCreate>({
    resolver: convertingResolver(measurementCreateSchema, (values: MeasurementFormValues) => toMeasurement(values) as never, {
      takenAt: 'Enter when the measurement was taken',
    }),
    defaultValues: emptyValues(lastGirth),
  });

  const onSubmit = handleSubmit((values) =>
    addMeasurement.mutateAsync(values).then(
      (result) => reset(emptyValues(result.measurement.girthLandmark ? result.measurement : lastGirth)),
      (error) => showServerErrors<MeasurementFormValues>(error, fieldNames, setError),
    ),
  );

  const formError = formWideError(errors);
  const number = (field: NumberField, label: string, unit: string, hint: string, integer = false) => (
    <TextField
      label={label}
      unit={unit}
      hint={hint}
      inputMode={integer ? 'numeric' : 'decimal'}
      autoComplete="off"
      error={errors[field]?.message}
      {...register(field)}
    />
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add a measurement" className="flex flex-col gap-4">
      {formError ? (
        <Notice kind="error" title="Measurement not saved">
          {formError}
        </Notice>
      ) : null}
      {addMeasurement.isSuccess ? (
        <p role="status" className="text-sm font-medium text-moss-700">
          Measurement saved.
        </p>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <TextField label="Taken at" type="datetime-local" max={toLocalInputValue(new Date())} error={errors.takenAt?.message} {...register('takenAt')} />
        {number('kneeFlexionDeg', 'Knee flexion, active', '°', 'Range of motion, 0–160°', true)}
        {number('painNprs', 'Pain, NPRS', '0–10', '0 no pain, 10 worst imaginable', true)}
        {number('skinfoldMm', 'Skinfold over the site', 'mm', '1–60 mm; informs the cold figures')}
      </div>
      <fieldset className="grid gap-4 rounded-lg border border-ink/15 p-3 sm:grid-cols-2 lg:grid-cols-4">
        <legend className="px-1 text-sm font-semibold">Girth, both sides at the same site</legend>
        {number('girthInjuredCm', 'Girth, injured side', 'cm', '10–120 cm')}
        {number('girthOtherCm', 'Girth, other side', 'cm', '10–120 cm')}
        <TextField label="Girth landmark" hint="e.g. anteromedial knee joint line" error={errors.girthLandmark?.message} {...register('girthLandmark')} />
        {number('girthDistanceCm', 'Distance from the landmark', 'cm', '0–40 cm; thigh: 18–20 cm above the joint line (Laupattarakasem et al. 2012)')}
      </fieldset>
      <fieldset className="grid gap-4 rounded-lg border border-ink/15 p-3 sm:grid-cols-2 lg:grid-cols-4">
        <legend className="px-1 text-sm font-semibold">Bruise</legend>
        {number('bruiseLengthCm', 'Bruise length', 'cm', '0–60 cm, the longest dimension')}
        {number('bruiseWidthCm', 'Bruise width', 'cm', '0–60 cm, across the length')}
        <TextAreaField className="sm:col-span-2" label="Notes" error={errors.notes?.message} {...register('notes')} />
      </fieldset>
      <div>
        <Button type="submit" disabled={addMeasurement.isPending}>
          {addMeasurement.isPending ? 'Saving…' : 'Save measurement'}
        </Button>
      </div>
    </form>
  );
}
