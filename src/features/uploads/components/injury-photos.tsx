import { Camera } from 'lucide-react';
import { MeasurementPhotoForm } from './measurement-photo-form';
import { PhotoStrip } from './photo-strip';

/** The injury page's photo panel: the strip by measurement date, and the form to add one. */
export function InjuryPhotos({ injuryId, measurements }: { injuryId: string; measurements: { id: string; takenAt: string }[] }) {
  return (
    <section aria-label="Bruise photos" className="flex flex-col gap-4 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 className="flex items-center gap-2 text-lg font-semibold">
        <Camera aria-hidden className="h-5 w-5 text-ink-soft" /> Bruise photos
      </h2>
      <PhotoStrip injuryId={injuryId} />
      <MeasurementPhotoForm injuryId={injuryId} measurements={measurements} />
      <p className="text-xs text-ink-muted">
        Photos are part of the athlete’s clinical record: take them only with the athlete’s consent, show only the injured area, and keep them in
        Mendstep rather than on a personal phone.
      </p>
    </section>
  );
}
