import { Link } from 'react-router-dom';
import { AlarmClock, CalendarClock, Dumbbell, Play, Ruler, Snowflake, Sprout, UserPlus, type LucideIcon } from 'lucide-react';
import { orderForToday } from '../../../../shared/clinic/recheck';
import type { Phase } from '../../../../shared/phase';
import type { InjuryView } from '../../../../shared/records/responses';
import { Notice } from '../../../components/ui/notice';
import { useOpenInjuries } from '../api/get-open-injuries';

// Same words and icons as the injury page: a phase is recognised by its word and shape, not its colour.
const phaseLook: Record<Phase, { word: string; Icon: LucideIcon; edge: string }> = {
  acute: { word: 'Acute', Icon: Snowflake, edge: 'border-l-phase-acute' },
  proliferative: { word: 'Proliferative', Icon: Sprout, edge: 'border-l-phase-proliferative' },
  remodelling: { word: 'Remodelling', Icon: Dumbbell, edge: 'border-l-phase-remodelling' },
};
const gradeWord = { mild: 'Mild', moderate: 'Moderate', severe: 'Severe' } as const;

const linkClass = {
  primary: 'inline-flex min-h-target items-center justify-center gap-2 rounded-lg bg-ink px-4 py-2 font-medium text-paper hover:bg-ink-soft',
  secondary: 'inline-flex min-h-target items-center justify-center gap-2 rounded-lg border border-ink/25 bg-paper-raised px-4 py-2 font-medium hover:bg-paper-sunk',
};

function measuredAgo(iso: string) {
  const minutes = Math.max(0, Math.round((Date.now() - Date.parse(iso)) / 60_000));
  if (minutes < 60) return minutes <= 1 ? 'just now' : `${minutes} min ago`;
  const hours = Math.round(minutes / 60);
  return hours < 48 ? `${hours} h ago` : `${Math.round(hours / 24)} days ago`;
}

const recheckTime = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

export function TodayBoard() {
  const injuries = useOpenInjuries();
  // Due and overdue re-checks lead the day's list.
  const ordered = injuries.data ? orderForToday(injuries.data) : [];
  const dueCount = ordered.filter((i) => i.recheckStatus === 'due' || i.recheckStatus === 'overdue').length;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-ink-soft" role="status">
          {injuries.isPending
            ? 'Loading open injuries…'
            : injuries.isSuccess
              ? `${injuries.data.length} open ${injuries.data.length === 1 ? 'injury' : 'injuries'}${dueCount ? ` · ${dueCount} ${dueCount === 1 ? 're-check' : 're-checks'} due, listed first` : ''}`
              : ''}
        </p>
        <Link to="/athletes?new=1" className={linkClass.secondary}>
          <UserPlus aria-hidden className="h-4 w-4" /> Register an athlete
        </Link>
      </div>
      <Notice kind="caution" title="Stop and refer to a physician at once">
        if you find pain out of proportion to the injury, pain on passive stretch, numbness or pins and needles, or a cold, pale limb. Screening asks
        again before every run.
      </Notice>
      {injuries.isError ? <p className="text-ember-700">{injuries.error.message}</p> : null}
      {injuries.isSuccess && injuries.data.length === 0 ? (
        <div className="rounded-xl bg-paper-raised p-6 text-center ring-1 ring-ink/10">
          <p className="text-lg font-semibold">No open injuries</p>
          <p className="mt-1 text-ink-muted">Record an injury from the athlete&rsquo;s page; it will appear here until it is closed.</p>
          <Link to="/athletes" className={`${linkClass.secondary} mt-4`}>
            Go to athletes
          </Link>
        </div>
      ) : null}
      {injuries.isSuccess && injuries.data.length > 0 ? (
        <ul className="grid gap-3 md:grid-cols-2 xl:grid-cols-3" aria-label="Open injuries">
          {ordered.map((injury) => (
            <TodayCard key={injury.id} injury={injury} />
          ))}
        </ul>
      ) : null}
    </div>
  );
}

function TodayCard({ injury }: { injury: InjuryView }) {
  const { word, Icon, edge } = phaseLook[injury.phase];
  return (
    <li className={`flex flex-col gap-2 rounded-xl border-l-8 bg-paper-raised p-4 ring-1 ring-ink/10 ${edge}`}>
      <div className="flex items-start justify-between gap-2">
        <h2 className="text-lg font-semibold leading-tight">{injury.athleteName}</h2>
        <span className="inline-flex shrink-0 items-center gap-1.5 rounded-full bg-paper-sunk px-2.5 py-0.5 text-sm font-semibold" data-testid="phase">
          <Icon aria-hidden className="h-4 w-4" />
          {word}
          <span className="sr-only"> phase</span>
          {injury.phaseIsOverride ? <span className="font-normal text-ink-muted">(override)</span> : null}
        </span>
      </div>
      <p>
        {injury.regionLabel}, {injury.side}
      </p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
        <dt className="text-ink-muted">Since injury</dt>
        <dd>day {injury.assessment.daysSinceInjury}</dd>
        <dt className="text-ink-muted">Severity</dt>
        <dd>{injury.severity ? `${gradeWord[injury.severity.grade]} (${injury.severity.kneeFlexionDeg}° knee flexion)` : 'Not graded'}</dd>
        <dt className="text-ink-muted">Re-check</dt>
        <dd>
          {injury.recheckStatus === 'overdue' ? (
            <strong className="inline-flex items-center gap-1 text-ember-700">
              <AlarmClock aria-hidden className="h-4 w-4" /> Overdue
            </strong>
          ) : injury.recheckStatus === 'due' ? (
            <strong className="inline-flex items-center gap-1 text-tide-700">
              <CalendarClock aria-hidden className="h-4 w-4" /> Due today
            </strong>
          ) : null}
          {injury.nextRecheckAt ? ` ${recheckTime.format(new Date(injury.nextRecheckAt))}` : 'not set'}
        </dd>
        <dt className="text-ink-muted">Measured</dt>
        <dd>
          {injury.lastMeasuredAt ? measuredAgo(injury.lastMeasuredAt) : 'not yet'}
          {injury.remeasureDue ? (
            <strong className="ml-2 inline-flex items-center gap-1 text-ember-700">
              <Ruler aria-hidden className="h-4 w-4" /> Re-measure due
            </strong>
          ) : null}
        </dd>
      </dl>
      <div className="mt-auto flex flex-wrap gap-2 pt-1">
        <Link to={`/runs/new?injuryId=${encodeURIComponent(injury.id)}`} className={linkClass.primary} aria-label={`Start a run for ${injury.athleteName}, ${injury.regionLabel}, ${injury.side}`}>
          <Play aria-hidden className="h-4 w-4" /> Start a run
        </Link>
        <Link to={`/injuries/${injury.id}`} className={linkClass.secondary} aria-label={`Open injury: ${injury.athleteName}, ${injury.regionLabel}, ${injury.side}`}>
          Open injury
        </Link>
      </div>
    </li>
  );
}
