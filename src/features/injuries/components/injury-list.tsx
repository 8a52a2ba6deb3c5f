import { Link } from 'react-router-dom';
import { Ruler } from 'lucide-react';
import type { InjuryView } from '../../../../shared/records/responses';
import { formatDateTime } from '../lib/time';
import { PhaseBadge } from './phase-badge';

const sideWord = { left: 'left', right: 'right' } as const;
export const injurySite = (injury: Pick<InjuryView, 'regionLabel' | 'side'>) => `${injury.regionLabel}, ${sideWord[injury.side]}`;

/** An athlete's injuries, open ones first, each a link to its page. */
export function InjuryList({ injuries }: { injuries: InjuryView[] }) {
  if (!injuries.length) return <p className="text-ink-muted">No injuries recorded for this athlete.</p>;
  const ordered = [...injuries].sort((a, b) => Number(a.status === 'closed') - Number(b.status === 'closed'));
  return (
    <ul className="flex flex-col gap-2">
      {ordered.map((injury) => (
        <li key={injury.id}>
          <Link
            to={`/injuries/${injury.id}`}
            className="flex min-h-target flex-wrap items-center gap-x-4 gap-y-1 rounded-lg border border-ink/15 bg-paper-raised px-3 py-2 hover:bg-paper-sunk"
          >
            <span className="font-semibold underline decoration-ink/30 underline-offset-4">{injurySite(injury)}</span>
            {injury.status === 'open' ? <PhaseBadge phase={injury.phase} /> : <span className="rounded-full bg-paper-sunk px-2.5 py-0.5 text-sm font-semibold">Closed</span>}
            <span className="text-sm text-ink-muted">
              Injured {formatDateTime(injury.injuredAt)} · day {injury.assessment.daysSinceInjury}
            </span>
            {injury.remeasureDue ? (
              <span className="inline-flex items-center gap-1 text-sm font-medium text-ember-700">
                <Ruler aria-hidden className="h-4 w-4" /> Re-measure due
              </span>
            ) : null}
          </Link>
        </li>
      ))}
    </ul>
  );
}
