import { Snowflake } from 'lucide-react';
import type { ColdSchedule } from '../../../../shared/clinical/cold-schedule';
import type { Phase } from '../../../../shared/phase';
import { clockFromIso } from '../lib/time';
import { Card, Source } from './card';

export function ColdScheduleCard({ schedule, phase }: { schedule: ColdSchedule; phase: Phase }) {
  const { otte, cautions } = schedule.information;
  return (
    <Card title="Cold schedule for today" icon={Snowflake}>
      {phase !== 'acute' ? (
        <p className="text-sm">
          Cold is the acute phase&rsquo;s treatment, and goes back on whenever swelling increases (common practice). This schedule is for those times.
        </p>
      ) : null}
      <p>{schedule.description}.</p>
      <Source>{schedule.source}</Source>
      {schedule.sessions.length ? (
        <ul className="flex flex-wrap gap-2" aria-label={`Cold sessions left today, ${schedule.timeZone} time`}>
          {schedule.sessions.map((session) => (
            <li key={session.startsAt} className="rounded-md bg-tide-50 px-2 py-1 text-sm font-medium tabular-nums text-tide-700">
              {clockFromIso(session.startsAt)}–{clockFromIso(session.endsAt)}
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm">No sessions left within today&rsquo;s waking hours.</p>
      )}
      <p className="text-xs text-ink-muted">Times in the clinic&rsquo;s zone ({schedule.timeZone}).</p>
      <div className="rounded-lg bg-paper-sunk p-3 text-sm">
        <p className="font-semibold">Fat layer and cooling time</p>
        {otte ? <p>{otte.text}</p> : <p>Record a skinfold over the site to see the published cooling figures for this fat layer (Otte et al. 2002).</p>}
        {otte ? <Source>{otte.source}</Source> : null}
      </div>
      <ul className="space-y-2 text-sm">
        {cautions.map((caution) => (
          <li key={caution.text} className="rounded-lg border-l-4 border-ember-500 bg-ember-50 p-2">
            <span className="font-semibold">Caution: </span>
            {caution.text}
            <span className="block text-xs text-ink-muted">Source: {caution.source}</span>
          </li>
        ))}
      </ul>
    </Card>
  );
}
