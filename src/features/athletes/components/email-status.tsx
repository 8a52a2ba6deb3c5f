import { MailX } from 'lucide-react';
import type { AthleteView } from '../../../../shared/records/responses';

const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

/**
 * "No e-mails (opted out on …)": the athlete used the link in an e-mail, so no home-care plan or reminder goes to
 * them; the therapist gives the plan in person. Renders nothing while e-mails are allowed.
 */
export function EmailOptOutNote({ athlete }: { athlete: Pick<AthleteView, 'emailOptedOutAt'> }) {
  if (!athlete.emailOptedOutAt) return null;
  return (
    <span className="inline-flex items-start gap-1.5 font-medium" data-testid="email-opted-out">
      <MailX aria-hidden className="mt-0.5 h-4 w-4 shrink-0" />
      <span>
        No e-mails (opted out on {day.format(new Date(athlete.emailOptedOutAt))}): give the home-care plan in person.
      </span>
    </span>
  );
}
