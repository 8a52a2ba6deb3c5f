import { useState } from 'react';
import { ShieldCheck, ShieldQuestion } from 'lucide-react';
import type { AthleteView } from '../../../../shared/records/responses';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useUpdateAthlete } from '../api/update-athlete';

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/** Consent changes only after a second, explicit confirmation: it is recorded against the therapist's name. */
export function ConsentPanel({ athlete }: { athlete: AthleteView }) {
  const [confirming, setConfirming] = useState(false);
  const update = useUpdateAthlete(athlete.id);
  const next = !athlete.consentToTreatment;

  return (
    <section aria-labelledby="consent-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id="consent-heading" className="text-lg font-semibold">
        Consent to treatment
      </h2>
      {athlete.consentToTreatment ? (
        <p className="flex items-start gap-2" data-testid="consent-status">
          <ShieldCheck aria-hidden className="mt-0.5 h-5 w-5 shrink-0 text-moss-600" />
          <span>
            <strong>Recorded</strong>
            {athlete.consentRecordedByName ? ` by ${athlete.consentRecordedByName}` : ''}
            {athlete.consentRecordedAt ? ` on ${when.format(new Date(athlete.consentRecordedAt))}` : ''}.
          </span>
        </p>
      ) : (
        <Notice kind="caution" title="Not recorded">
          Ask the athlete for consent and record it before treating.
        </Notice>
      )}
      {update.isError ? (
        <Notice kind="error" title="Consent not changed">
          {update.error.message}
        </Notice>
      ) : null}
      {confirming ? (
        <div role="group" aria-label="Confirm the change of consent" className="flex flex-col gap-2 rounded-lg border border-ink/20 p-3">
          <p className="flex items-start gap-2 font-medium">
            <ShieldQuestion aria-hidden className="mt-0.5 h-5 w-5 shrink-0" />
            {next ? `Confirm that ${athlete.name} has consented to treatment.` : `Confirm that ${athlete.name} has withdrawn consent to treatment.`}
          </p>
          <div className="flex flex-wrap gap-2">
            <Button
              variant={next ? 'primary' : 'danger'}
              disabled={update.isPending}
              onClick={() => update.mutate({ consentToTreatment: next }, { onSuccess: () => setConfirming(false) })}
            >
              {update.isPending ? 'Saving…' : next ? 'Confirm consent' : 'Confirm withdrawal'}
            </Button>
            <Button variant="secondary" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
          </div>
        </div>
      ) : (
        <Button variant="secondary" className="self-start" onClick={() => setConfirming(true)}>
          {next ? 'Record consent' : 'Withdraw consent'}
        </Button>
      )}
    </section>
  );
}
