import { useState } from 'react';
import { Pencil } from 'lucide-react';
import { Notice } from '../../../components/ui/notice';
import type { AthleteView } from '../../../../shared/records/responses';
import { Button } from '../../../components/ui/button';
import { useUpdateAthlete } from '../api/update-athlete';
import { AthleteForm } from './athlete-form';
import { ConsentPanel } from './consent-panel';
import { EmailOptOutNote } from './email-status';
import { GuardianConsentPanel } from './guardian-consent-panel';

export function AthleteProfile({ athlete }: { athlete: AthleteView }) {
  const [editing, setEditing] = useState(false);
  const update = useUpdateAthlete(athlete.id);

  return (
    <div className="flex flex-col gap-4">
      {athlete.erasedAt ? (
        <Notice kind="info" title="Personal data erased">
          An admin erased this athlete&rsquo;s personal data on {new Date(athlete.erasedAt).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric' })}, at
          their request. Their injuries, measurements and runs stay for the clinic&rsquo;s figures; nothing new can be recorded for them.
        </Notice>
      ) : null}
      <section aria-labelledby="details-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="details-heading" className="text-lg font-semibold">
            Details
          </h2>
          {editing || athlete.erasedAt ? null : (
            <Button variant="secondary" onClick={() => setEditing(true)}>
              <Pencil aria-hidden className="h-4 w-4" /> Edit
            </Button>
          )}
        </div>
        {editing ? (
          <AthleteForm athlete={athlete} submitLabel="Save changes" onSave={(values) => update.mutateAsync(values).then(() => setEditing(false))} onCancel={() => setEditing(false)} />
        ) : (
          <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1">
            <dt className="text-ink-muted">Year of birth</dt>
            <dd>{athlete.yearOfBirth}</dd>
            <dt className="text-ink-muted">Sport</dt>
            <dd>{athlete.sport}</dd>
            <dt className="text-ink-muted">Position</dt>
            <dd>{athlete.position ?? '—'}</dd>
            <dt className="text-ink-muted">E-mail</dt>
            <dd className="flex flex-col gap-1">
              {athlete.email ?? '—'}
              <EmailOptOutNote athlete={athlete} />
            </dd>
            <dt className="text-ink-muted">Notes</dt>
            <dd className="whitespace-pre-line">{athlete.notes ?? '—'}</dd>
          </dl>
        )}
      </section>
      {athlete.erasedAt ? null : <ConsentPanel athlete={athlete} />}
      {athlete.erasedAt ? null : <GuardianConsentPanel athlete={athlete} />}
    </div>
  );
}
