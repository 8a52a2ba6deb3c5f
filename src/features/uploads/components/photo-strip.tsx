import { ImageOff } from 'lucide-react';
import type { PhotoView } from '../../../../shared/uploads/uploads';
import { useInjuryPhotos } from '../api/get-injury-photos';
import { takenWhen } from './format';

/** Photos grouped under the measurement they belong to, oldest first, so a bruise's change reads left to right. */
export function PhotoStrip({ injuryId }: { injuryId: string }) {
  const photos = useInjuryPhotos(injuryId);
  if (photos.isPending) return <p className="text-ink-muted">Loading photos…</p>;
  if (photos.isError) return <p className="text-ember-700">Could not load the photos: {photos.error.message}</p>;
  if (!photos.data.length) {
    return (
      <p className="flex items-center gap-2 text-ink-muted">
        <ImageOff aria-hidden className="h-5 w-5" /> No photos yet. Add one to a measurement below.
      </p>
    );
  }
  const groups: { measurementId: string; takenAt: string; photos: PhotoView[] }[] = [];
  for (const photo of photos.data) {
    const last = groups.at(-1);
    if (last?.measurementId === photo.measurementId) last.photos.push(photo);
    else groups.push({ measurementId: photo.measurementId, takenAt: photo.takenAt, photos: [photo] });
  }
  return (
    <ol className="flex gap-4 overflow-x-auto pb-2" aria-label="Photos by measurement date, oldest first" data-testid="photo-strip">
      {groups.map((group) => (
        <li key={group.measurementId} className="flex shrink-0 flex-col gap-2">
          <h3 className="text-sm font-semibold">Measured {takenWhen(group.takenAt)}</h3>
          <div className="flex gap-2">
            {group.photos.map((photo) => (
              <a key={photo.id} href={photo.url} target="_blank" rel="noreferrer" className="block rounded-lg ring-1 ring-ink/15 focus-visible:outline-2">
                <img
                  src={photo.url}
                  alt={`Bruise photo from the measurement of ${takenWhen(group.takenAt)}`}
                  loading="lazy"
                  className="h-40 w-40 rounded-lg bg-paper-sunk object-cover"
                />
              </a>
            ))}
          </div>
        </li>
      ))}
    </ol>
  );
}
