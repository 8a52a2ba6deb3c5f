import { CheckCircle2, MailX } from 'lucide-react';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useOptOutLink } from '../api/check-opt-out-link';
import { useConfirmOptOut } from '../api/confirm-opt-out';

const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric' });

/**
 * The page behind the link at the foot of every e-mail to an athlete. Opening the link changes nothing (mail
 * programs and scanners open links by themselves); the athlete confirms with the button.
 */
export function OptOutForm({ token }: { token: string }) {
  const link = useOptOutLink(token);
  const confirm = useConfirmOptOut();

  if (confirm.isSuccess) {
    return (
      <div role="status" className="flex gap-3 rounded-lg border-l-4 border-moss-500 bg-moss-50 p-3">
        <CheckCircle2 aria-hidden className="mt-0.5 h-5 w-5 shrink-0" />
        <div>
          <p className="font-semibold">You will get no more e-mails</p>
          <p className="text-sm">
            {confirm.data.clinicName} will not e-mail you from now on (since {day.format(new Date(confirm.data.optedOutAt))}). Your therapist can see this. If
            you change your mind, tell them at your next visit.
          </p>
        </div>
      </div>
    );
  }

  if (!token || link.isError) {
    const message = !token
      ? 'This link is incomplete. Open it again from the e-mail.'
      : link.error instanceof ApiError
        ? link.error.message
        : 'Could not reach the clinic’s server. Check the connection and reload.';
    return (
      <Notice kind="error" title="This link cannot be used">
        {message}
      </Notice>
    );
  }
  if (link.isPending) return <p className="text-ink-muted">Checking the link…</p>;

  const failed = confirm.error instanceof ApiError ? confirm.error.message : confirm.error ? 'Could not reach the clinic’s server. Try again.' : null;

  return (
    <div className="flex flex-col gap-4">
      <p>
        Stop all e-mails from <strong>{link.data.clinicName}</strong>: home-care plans after treatment and their cold reminders.
      </p>
      <Notice kind="caution" title="Your care advice">
        Without e-mails, the home-care plan and the signs that need urgent care reach you only in person. Ask your therapist for them at each visit.
      </Notice>
      {failed ? (
        <Notice kind="error" title="Not changed">
          {failed}
        </Notice>
      ) : null}
      <Button onClick={() => confirm.mutate(token)} disabled={confirm.isPending}>
        <MailX aria-hidden className="h-4 w-4" />
        {confirm.isPending ? 'Saving…' : 'Stop e-mails'}
      </Button>
    </div>
  );
}
