import { useId, useRef, useState, type FormEvent } from 'react';
import { CheckCircle2, ImagePlus } from 'lucide-react';
import { uploadRules } from '../../../../shared/uploads/uploads';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useUploadMeasurementPhoto } from '../api/upload-measurement-photo';
import { takenWhen } from './format';

const rule = uploadRules['measurement-photo'];

/** Adds a photo of the bruise to one of the injury's measurements (the newest by default). */
export function MeasurementPhotoForm({ injuryId, measurements }: { injuryId: string; measurements: { id: string; takenAt: string }[] }) {
  const newestFirst = [...measurements].sort((a, b) => Date.parse(b.takenAt) - Date.parse(a.takenAt));
  const [measurementId, setMeasurementId] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const [tooBig, setTooBig] = useState(false);
  const input = useRef<HTMLInputElement>(null);
  const upload = useUploadMeasurementPhoto(injuryId);
  const ids = { measurement: useId(), file: useId() };
  const chosen = measurementId || newestFirst[0]?.id || '';

  if (!newestFirst.length) return <p className="text-ink-muted">Record a measurement first; photos are kept with a measurement.</p>;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!file || tooBig || !chosen) return;
    upload.mutate(
      { measurementId: chosen, file },
      {
        onSuccess: () => {
          setFile(null);
          if (input.current) input.current.value = '';
        },
      },
    );
  };

  const serverError = upload.error instanceof ApiError ? (upload.error.fields?.file ?? upload.error.message) : upload.error ? 'Could not reach Mendstep. Try again.' : null;
  const sizeError = tooBig ? `The photo is larger than ${rule.maxBytes / 1024 / 1024} MB. Choose a smaller one.` : null;

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" aria-label="Add a bruise photo">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.measurement} className="text-sm font-medium">
            Measurement
          </label>
          <select
            id={ids.measurement}
            value={chosen}
            onChange={(e) => setMeasurementId(e.target.value)}
            className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2"
          >
            {newestFirst.map((m) => (
              <option key={m.id} value={m.id}>
                {takenWhen(m.takenAt)}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.file} className="text-sm font-medium">
            Photo <span className="font-normal text-ink-muted">(JPEG, PNG or WebP, up to {rule.maxBytes / 1024 / 1024} MB)</span>
          </label>
          <input
            ref={input}
            id={ids.file}
            type="file"
            accept={rule.accepted.join(',')}
            aria-invalid={sizeError || serverError ? true : undefined}
            onChange={(e) => {
              const next = e.target.files?.[0] ?? null;
              upload.reset();
              setFile(next);
              setTooBig(Boolean(next && next.size > rule.maxBytes));
            }}
            className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2 file:mr-3 file:min-h-[36px] file:rounded-md file:border-0 file:bg-paper-sunk file:px-3 file:font-medium"
          />
        </div>
        <Button type="submit" disabled={!file || tooBig || upload.isPending}>
          <ImagePlus aria-hidden className="h-4 w-4" />
          {upload.isPending ? 'Uploading…' : 'Add photo'}
        </Button>
      </div>
      {sizeError || serverError ? (
        <Notice kind="error" title="Photo not added">
          {sizeError ?? serverError}
        </Notice>
      ) : null}
      {upload.isSuccess ? (
        <p role="status" className="flex items-center gap-2 text-sm font-medium text-moss-700">
          <CheckCircle2 aria-hidden className="h-4 w-4" /> Photo added to the measurement of {takenWhen(upload.data.takenAt)}.
        </p>
      ) : null}
    </form>
  );
}
