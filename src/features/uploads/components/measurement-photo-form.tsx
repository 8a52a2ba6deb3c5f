import { useId, useState, type FormEvent } from 'react';
import { CheckCircle2, ImagePlus } from 'lucide-react';
import { uploadRules } from '../../../../shared/uploads/uploads';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useUploadMeasurementPhoto } from '../api/upload-measurement-photo';
import { FileField, useChosenFile } from './file-field';
import { takenWhen } from './format';

const rule = uploadRules['measurement-photo'];

/** Adds a photo of the bruise to one of the injury's measurements (the newest by default). */
export function MeasurementPhotoForm({ injuryId, measurements }: { injuryId: string; measurements: { id: string; takenAt: string }[] }) {
  const newestFirst = [...measurements].sort((a, b) => Date.parse(b.takenAt) - Date.parse(a.takenAt));
  const [measurementId, setMeasurementId] = useState('');
  const upload = useUploadMeasurementPhoto(injuryId);
  const chosenFile = useChosenFile('measurement-photo', upload);
  const ids = { measurement: useId() };
  const chosen = measurementId || newestFirst[0]?.id || '';

  if (!newestFirst.length) return <p className="text-ink-muted">Record a measurement first; photos are kept with a measurement.</p>;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!chosenFile.ready || !chosen) return;
    upload.mutate({ measurementId: chosen, file: chosenFile.ready }, { onSuccess: chosenFile.clear });
  };


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
        <FileField
          ref={chosenFile.input}
          label={
            <>
              Photo <span className="font-normal text-ink-muted">(JPEG, PNG or WebP, up to {rule.maxBytes / 1024 / 1024} MB)</span>
            </>
          }
          accept={rule.accepted}
          invalid={Boolean(chosenFile.error)}
          onPick={chosenFile.pick}
        />
        <Button type="submit" disabled={!chosenFile.ready || upload.isPending}>
          <ImagePlus aria-hidden className="h-4 w-4" />
          {upload.isPending ? 'Uploading…' : 'Add photo'}
        </Button>
      </div>
      {chosenFile.error ? (
        <Notice kind="error" title="Photo not added">
          {chosenFile.error}
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
