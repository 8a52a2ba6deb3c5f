import { UserPlus } from 'lucide-react';
import type { AthleteView } from '../../../../shared/records/responses';
import { useCreateAthlete } from '../api/create-athlete';
import { AthleteForm } from './athlete-form';

/** An inline panel rather than a dialog: on a tablet the keyboard and a modal fight for the same half-screen. */
export function AddAthletePanel({ onAdded, onCancel }: { onAdded: (athlete: AthleteView) => void; onCancel: () => void }) {
  const create = useCreateAthlete();
  return (
    <section aria-labelledby="add-athlete-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-2 ring-ink/20">
      <h2 id="add-athlete-heading" className="flex items-center gap-2 text-lg font-semibold">
        <UserPlus aria-hidden className="h-5 w-5" /> Add athlete
      </h2>
      <AthleteForm submitLabel="Add athlete" onSave={(values) => create.mutateAsync(values).then(onAdded)} onCancel={onCancel} />
    </section>
  );
}
