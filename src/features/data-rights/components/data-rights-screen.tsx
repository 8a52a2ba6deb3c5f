import { useDeferredValue, useId, useState } from 'react';
import { CheckCircle2, Download, MailX, Search, ShieldOff, Trash2 } from 'lucide-react';
import type { DataRightsAthlete } from '../../../../shared/data-rights/data-rights';
import { Button } from '../../../components/ui/button';
import { athleteExportUrl, useDataRightsAthletes } from '../api/search-athletes';
import { counted } from './counted';
import { ErasePanel } from './erase-panel';

const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

/** Admins answer an athlete's request for their data (an export) or for erasure. */
export function DataRightsScreen() {
  const [q, setQ] = useState('');
  const deferred = useDeferredValue(q.trim());
  const athletes = useDataRightsAthletes(deferred);
  const [erasing, setErasing] = useState<DataRightsAthlete | null>(null);
  const searchId = useId();

  return (
    <div className="flex flex-col gap-4">
      <p className="max-w-3xl text-ink-soft">
        When an athlete asks for a copy of what the clinic holds on them, export it: one zip with every record as JSON and as CSV files, and their uploaded
        photos and forms. When they ask to be forgotten, erase their personal data. Both are recorded on the audit trail.
      </p>
      <div className="flex max-w-xl flex-col gap-1">
        <label htmlFor={searchId} className="text-sm font-medium">
          Athlete&rsquo;s name
        </label>
        <div className="relative">
          <Search aria-hidden className="pointer-events-none absolute left-3 top-1/2 h-4 w-4 -translate-y-1/2 text-ink-muted" />
          <input
            id={searchId}
            type="search"
            value={q}
            onChange={(e) => setQ(e.target.value)}
            placeholder="Part of the name"
            autoComplete="off"
            className="min-h-target w-full rounded-lg border border-ink/30 bg-paper-raised py-2 pl-9 pr-3"
          />
        </div>
      </div>
      {athletes.isError ? <p className="text-ember-700">{athletes.error.message}</p> : null}
      {athletes.isPending ? <p className="text-ink-muted">Searching…</p> : null}
      {athletes.data ? (
        athletes.data.length ? (
          <div className="overflow-x-auto rounded-xl bg-paper-raised ring-1 ring-ink/10">
            <table className="w-full text-left">
              <caption className="sr-only">Athletes matching the search</caption>
              <thead className="bg-paper-sunk text-sm">
                <tr>
                  {['Athlete', 'Born', 'Held', 'Status'].map((heading) => (
                    <th key={heading} scope="col" className="px-4 py-3 font-semibold">
                      {heading}
                    </th>
                  ))}
                  <th scope="col" className="px-4 py-3">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {athletes.data.map((athlete) => (
                  <tr key={athlete.id} className="border-t border-ink/10 align-top">
                    <td className="px-4 py-3 font-medium">{athlete.name}</td>
                    <td className="px-4 py-3 tabular-nums">{athlete.yearOfBirth}</td>
                    <td className="px-4 py-3 text-sm">
                      {[
                        counted(athlete.counts.injuries, 'injury', 'injuries'),
                        counted(athlete.counts.measurements, 'measurement'),
                        counted(athlete.counts.runs, 'run'),
                        counted(athlete.counts.sessionNotes, 'session note'),
                        counted(athlete.counts.files, 'file'),
                        counted(athlete.counts.emails, 'e-mail'),
                      ].join(' · ')}
                    </td>
                    <td className="px-4 py-3 text-sm">
                      <Status athlete={athlete} />
                    </td>
                    <td className="px-4 py-2">
                      <div className="flex flex-wrap justify-end gap-2">
                        <a
                          href={athleteExportUrl(athlete.id)}
                          download
                          className="inline-flex min-h-target items-center gap-2 rounded-lg border border-ink/25 px-4 py-2 font-medium hover:bg-paper-sunk"
                          aria-label={`Export the data of ${athlete.name} (zip)`}
                        >
                          <Download aria-hidden className="h-4 w-4" /> Export
                        </a>
                        {athlete.erasedAt ? null : (
                          <Button variant="secondary" onClick={() => setErasing(athlete)} aria-label={`Erase the personal data of ${athlete.name}`}>
                            <Trash2 aria-hidden className="h-4 w-4" /> Erase…
                          </Button>
                        )}
                      </div>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : (
          <p className="text-ink-muted">No athlete of your clinic has a name like that.</p>
        )
      ) : null}
      {erasing ? <ErasePanel key={erasing.id} athlete={erasing} onClose={() => setErasing(null)} /> : null}
    </div>
  );
}

function Status({ athlete }: { athlete: DataRightsAthlete }) {
  if (athlete.erasedAt) {
    return (
      <span className="inline-flex items-center gap-1.5">
        <ShieldOff aria-hidden className="h-4 w-4" /> Erased {day.format(new Date(athlete.erasedAt))}
      </span>
    );
  }
  return (
    <span className="flex flex-col gap-1">
      <span className="inline-flex items-center gap-1.5">
        <CheckCircle2 aria-hidden className="h-4 w-4 text-moss-600" /> Held
      </span>
      {athlete.emailOptedOutAt ? (
        <span className="inline-flex items-center gap-1.5">
          <MailX aria-hidden className="h-4 w-4" /> No e-mails since {day.format(new Date(athlete.emailOptedOutAt))}
        </span>
      ) : null}
    </span>
  );
}
