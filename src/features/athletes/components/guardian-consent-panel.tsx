import { useId, useState } from 'react';
import { ShieldCheck, Users } from 'lucide-react';
import type { AthleteView } from '../../../../shared/records/responses';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useUpdateAthlete } from '../api/update-athlete';

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/**
 * A parent's or guardian's consent, recorded with their name, who took it and when. Runs for an athlete who is
 * or may be under 18 (by year of birth, erring safe) cannot start without it; for anyone else it can still be recorded when in doubt.
 */
export function GuardianConsentPanel({ athlete }: { athlete: AthleteView }) {
  const [editing, setEditing] = useState(false);
  const [name, setName] = useState('');
  const update = useUpdateAthlete(athlete.id);
  const inputId = useId();
  const consent = athlete.guardianConsent ?? null;
  const needed = athlete.needsGuardianConsent ?? false;
  if (!needed && !consent && !editing) {
    return (
      <Button variant="ghost" className="self-start text-sm" onClick={() => setEditing(true)}>
        <Users aria-hidden className="h-4 w-4" /> Record a guardian&rsquo;s consent
      </Button>
    );
  }

  return (
    <section aria-labelledby={`${inputId}-heading`} className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id={`${inputId}-heading`} className="text-lg font-semibold">
        Guardian&rsquo;s consent
      </h2>
      {consent ? (
        <p className="flex items-start gap-2" data-testid="guardian-consent-status">
          <ShieldCheck aria-hidden className="mt-0.5 h-5 w-5 shrink-0 text-moss-600" />
          <span>
            <strong>Recorded</strong>: {consent.guardianName}
            {consent.recordedByName ? `, taken by ${consent.recordedByName}` : ''} on {when.format(new Date(consent.recordedAt))}.
          </span>
        </p>
      ) : (
        <Notice kind="caution" title="Needed before any run">
          {athlete.guardianConsentReason ?? `${athlete.name} is under 18 (born ${athlete.yearOfBirth}).`} Record the consent of a parent or guardian before starting a run.
        </Notice>
      )}
      {update.isError ? (
        <Notice kind="error" title="Not changed">
          {update.error.message}
        </Notice>
      ) : null}
      {editing ? (
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            update.mutate({ guardianConsent: { guardianName: name } }, { onSuccess: () => setEditing(false) });
          }}
        >
          <div className="flex flex-col gap-1">
            <label htmlFor={inputId} className="text-sm font-medium">
              Parent or guardian who consented
            </label>
            <input id={inputId} value={name} onChange={(e) => setName(e.target.value)} placeholder="Name, and relation" className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2" />
          </div>
          <Button type="submit" disabled={update.isPending || name.trim().length < 2}>
            {update.isPending ? 'Saving…' : 'Record consent'}
          </Button>
          <Button variant="secondary" onClick={() => setEditing(false)}>
            Cancel
          </Button>
        </form>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setEditing(true)}>
            {consent ? 'Record a new consent' : 'Record consent'}
          </Button>
          {consent ? (
            <Button variant="ghost" disabled={update.isPending} onClick={() => update.mutate({ guardianConsent: null })}>
              Withdraw
            </Button>
          ) : null}
        </div>
      )}
    </section>
  );
}
