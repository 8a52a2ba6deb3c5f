import type { ReactNode } from 'react';
import type { LucideIcon } from 'lucide-react';
import { Activity, CircleStop, Clock3, Flag, SkipForward, Undo2, UserRound } from 'lucide-react';
import type { MeasurementView } from '../../../../shared/records/responses';
import type { RunLogEntryView } from '../../../../shared/runs/responses';
import { Notice } from '../../../components/ui/notice';
import type { ReviewRunDetail } from '../../../../shared/review/responses';
import { formatClock, formatDateTime, formatTime } from '../lib/format';
import { attentionLook, Badge, outcomeFor, PhaseLabel } from './status-badges';

/** A titled part of the run's page; the heading lets screen-reader users jump between parts. */
export function Section({ title, icon: Icon, children, className = '' }: { title: string; icon: LucideIcon; children: ReactNode; className?: string }) {
  return (
    <section aria-label={title} className={`flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10 ${className}`}>
      <h2 className="flex items-center gap-2 text-lg font-semibold">
        <Icon aria-hidden className="h-5 w-5 text-ink-soft" />
        {title}
      </h2>
      {children}
    </section>
  );
}

export function ReviewRunHeader({ detail }: { detail: ReviewRunDetail }) {
  const { run } = detail;
  return (
    <header className="flex flex-col gap-2">
      <h1 className="text-2xl font-semibold">Run review — {run.athleteName}</h1>
      <dl className="flex flex-wrap items-center gap-x-6 gap-y-2">
        <div className="flex items-center gap-2">
          <dt className="sr-only">Injury</dt>
          <dd className="capitalize">{run.injuryLabel}</dd>
        </div>
        <div className="flex items-center gap-2">
          <dt className="text-sm text-ink-muted">Therapist</dt>
          <dd className="inline-flex items-center gap-1 font-medium">
            <UserRound aria-hidden className="h-4 w-4" />
            {run.therapistName}
          </dd>
        </div>
        <div className="flex items-center gap-2">
          <dt className="text-sm text-ink-muted">Phase</dt>
          <dd className="font-medium">
            <PhaseLabel phase={run.phase} />
          </dd>
        </div>
        <div className="flex items-center gap-2">
          <dt className="text-sm text-ink-muted">Outcome</dt>
          <dd data-testid="run-outcome">
            <Badge look={outcomeFor(run.outcome, run.status)} />
          </dd>
        </div>
        {detail.attention.length ? (
          <div className="flex items-center gap-2">
            <dt className="text-sm text-ink-muted">Needs attention</dt>
            <dd className="flex flex-wrap gap-1">
              {detail.attention.map((kind) => (
                <Badge key={kind} look={attentionLook[kind]} />
              ))}
            </dd>
          </div>
        ) : null}
        <div className="flex items-center gap-2">
          <dt className="text-sm text-ink-muted">When</dt>
          <dd>
            {formatDateTime(run.startedAt ?? run.createdAt)}
            {run.endedAt ? ` – ${formatTime(run.endedAt)}` : ''}
          </dd>
        </div>
        <div className="flex items-center gap-2">
          <dt className="text-sm text-ink-muted">Sequence</dt>
          <dd>{run.sequenceVersion ? `version ${run.sequenceVersion}` : 'not recorded'}, {run.plan.tolerance} tolerance</dd>
        </div>
      </dl>
      {run.message ? (
        <Notice kind="caution" title="Stop and refer">
          {run.message}
        </Notice>
      ) : null}
      {run.plan.cautions.length ? (
        <Notice kind="caution" title="Cautions acknowledged at screening">
          <ul className="list-disc pl-5">
            {run.plan.cautions.map((caution) => (
              <li key={caution}>{caution}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
    </header>
  );
}

const eventLook: Partial<Record<RunLogEntryView['type'], { word: string; Icon: LucideIcon }>> = {
  'swelling-check': { word: 'Swelling check', Icon: Activity },
  'step-skipped': { word: 'Step skipped', Icon: SkipForward },
  'step-interrupted': { word: 'Step interrupted', Icon: CircleStop },
  'red-flag': { word: 'Red flag', Icon: Flag },
  'run-fell-back': { word: 'Back to cold', Icon: Undo2 },
  'run-ended-early': { word: 'Run ended early', Icon: CircleStop },
  extended: { word: 'Step extended', Icon: Clock3 },
};

/** The entries a supervisor asks about: swelling checks and every reason given for leaving the plan. */
export function RunEvents({ entries }: { entries: RunLogEntryView[] }) {
  const events = entries.filter((entry) => eventLook[entry.type]);
  if (events.length === 0) return <p className="text-ink-muted">No swelling checks, skips or early end in this run.</p>;
  return (
    <ol className="flex flex-col gap-2">
      {events.map((entry) => {
        const { word, Icon } = eventLook[entry.type]!;
        const increased = entry.type === 'swelling-check' && entry.detail === 'increased';
        return (
          <li key={entry.id} className={`flex gap-3 rounded-lg border-l-4 p-2 ${increased || entry.type === 'red-flag' ? 'border-ember-600 bg-ember-50' : 'border-ink/20'}`}>
            <span className="w-20 shrink-0 tabular-nums text-ink-muted">{formatClock(entry.at)}</span>
            <span className="flex flex-col">
              <span className="inline-flex items-center gap-1 font-medium">
                <Icon aria-hidden className="h-4 w-4" />
                {word}
                {entry.type === 'swelling-check' ? `: ${increased ? 'swelling increased' : (entry.detail ?? 'recorded')}` : ''}
                {entry.stepIndex !== null && entry.kind ? <span className="font-normal text-ink-muted">· step {entry.stepIndex + 1}, {entry.kind.replace(/-/g, ' ')}</span> : null}
              </span>
              {entry.reason ? <span>Reason: {entry.reason}</span> : null}
              {entry.type !== 'swelling-check' && entry.detail ? <span className="text-sm text-ink-muted">{entry.detail}</span> : null}
            </span>
          </li>
        );
      })}
    </ol>
  );
}

type Row = { label: string; unit: string; value: (m: MeasurementView) => number | null; lowerIsBetter?: boolean };

const girthDifference = (m: MeasurementView) =>
  m.girthInjuredCm !== null && m.girthOtherCm !== null ? Math.round((m.girthInjuredCm - m.girthOtherCm) * 10) / 10 : null;

const rows: Row[] = [
  { label: 'Girth, injured side', unit: 'cm', value: (m) => m.girthInjuredCm },
  { label: 'Girth, other side', unit: 'cm', value: (m) => m.girthOtherCm },
  { label: 'Girth difference', unit: 'cm', value: girthDifference },
  { label: 'Knee flexion, active', unit: '°', value: (m) => m.kneeFlexionDeg },
  { label: 'Pain, NPRS', unit: '/10', value: (m) => m.painNprs },
  { label: 'Bruise length', unit: 'cm', value: (m) => m.bruiseLengthCm },
  { label: 'Bruise width', unit: 'cm', value: (m) => m.bruiseWidthCm },
];

// "4/10" and "100°" read as one figure; centimetres take a space.
const withUnit = (value: number, unit: string) => `${value}${/^[/°]/.test(unit) ? '' : ' '}${unit}`;
const show = (value: number | null, unit: string) => (value === null ? '—' : withUnit(value, unit));

/** The readings taken before and after the run, side by side, with the change between them. */
export function MeasurementsCompare({ before, after }: { before: MeasurementView | null; after: MeasurementView | null }) {
  if (!before && !after) return <p className="text-ink-muted">No measurements were taken around this run.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Measurements before and after the run</caption>
        <thead>
          <tr className="border-b border-ink/15">
            <th scope="col" className="px-3 py-2">Reading</th>
            <th scope="col" className="px-3 py-2">Before{before ? <span className="block font-normal text-ink-muted">{formatDateTime(before.takenAt)}</span> : null}</th>
            <th scope="col" className="px-3 py-2">After{after ? <span className="block font-normal text-ink-muted">{formatDateTime(after.takenAt)}</span> : null}</th>
            <th scope="col" className="px-3 py-2">Change</th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {rows.map((row) => {
            const a = before ? row.value(before) : null;
            const b = after ? row.value(after) : null;
            const change = a !== null && b !== null ? Math.round((b - a) * 10) / 10 : null;
            return (
              <tr key={row.label} className="border-t border-ink/10">
                <th scope="row" className="px-3 py-2 font-medium">{row.label}</th>
                <td className="px-3 py-2">{show(a, row.unit)}</td>
                <td className="px-3 py-2">{show(b, row.unit)}</td>
                <td className="px-3 py-2">{change === null ? '—' : `${change > 0 ? '+' : ''}${withUnit(change, row.unit)}`}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {!before || !after ? <p className="mt-2 text-sm text-ink-muted">Only one set of readings was taken {before ? 'before' : 'after'} this run.</p> : null}
    </div>
  );
}
