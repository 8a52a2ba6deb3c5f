import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ArrowLeft, ClipboardList, FileText, Play, Ruler } from 'lucide-react';
import type { InjuryDetailView } from '../../../../shared/records/responses';
import { ApiError } from '../../../lib/api-client';
import { useInjury } from '../api/get-injury';
import { formatDateTime, timeAgo } from '../lib/time';
import { Card } from './card';
import { CautionsCard, RedFlagsBanner } from './cautions-card';
import { ColdScheduleCard } from './cold-schedule-card';
import { linkButtonClass } from './fields';
import { injurySite } from './injury-list';
import { MeasurementCharts } from './measurement-charts';
import { MeasurementForm } from './measurement-form';
import { MeasurementHistory } from './measurement-history';
import { PadCard } from './pad-card';
import { PhaseCard } from './phase-card';
import { ProgressCard } from './progress-card';
import { haematomaWords, mechanismWords } from './record-injury-form';
import { SeverityCard } from './severity-card';

/** `operations`: the re-check and closing panels, composed in by the route (features do not import each other). */
export function InjuryDetail({ injuryId, operations }: { injuryId: string; operations?: ReactNode }) {
  const detail = useInjury(injuryId);
  if (detail.isPending) return <p className="text-ink-muted">Loading the injury…</p>;
  if (detail.isError) {
    const notFound = detail.error instanceof ApiError && (detail.error.status === 404 || detail.error.status === 400);
    return (
      <div>
        <h1 className="text-2xl font-semibold">{notFound ? 'Injury not found' : 'Could not load the injury'}</h1>
        <p className="mt-2 text-ink-muted">{notFound ? 'It may belong to another clinic, or the link is wrong.' : detail.error.message}</p>
        <Link to="/today" className={`${linkButtonClass.secondary} mt-4`}>
          Back to Today
        </Link>
      </div>
    );
  }
  return <InjuryPage detail={detail.data} operations={operations} />;
}

function InjuryPage({ detail, operations }: { detail: InjuryDetailView; operations?: ReactNode }) {
  const { injury, athlete, measurements, coldSchedule } = detail;
  const lastGirth = [...measurements].reverse().find((m) => m.girthLandmark !== null);
  const open = injury.status === 'open';

  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div className="flex flex-col gap-1">
          <Link to={`/athletes/${athlete.id}`} className="inline-flex min-h-target items-center gap-1 self-start font-medium underline underline-offset-4">
            <ArrowLeft aria-hidden className="h-4 w-4" /> {athlete.name}
          </Link>
          <h1 className="text-2xl font-semibold">{injurySite(injury)}</h1>
          <p className="text-ink-soft">
            <span className="font-semibold">Day {injury.assessment.daysSinceInjury} since injury</span> · injured {formatDateTime(injury.injuredAt)} ·{' '}
            {open ? 'Open' : `Closed${injury.closedAt ? ` ${formatDateTime(injury.closedAt)}` : ''}`}
          </p>
          <p className="text-sm text-ink-muted">
            {mechanismWords[injury.mechanismKind as keyof typeof mechanismWords] ?? injury.mechanismKind}
            {injury.mechanism ? `: ${injury.mechanism}` : ''} · Haematoma: {haematomaWords[injury.haematomaType as keyof typeof haematomaWords] ?? injury.haematomaType}
            {injury.previousQuadricepsInjury ? ' · Previous quadriceps injury' : ''}
            {injury.kneeEffusion ? ' · Knee effusion' : ''}
          </p>
          <p className="flex items-center gap-1 text-sm">
            <Ruler aria-hidden className="h-4 w-4" />
            {injury.lastMeasuredAt ? `Last measured ${timeAgo(injury.lastMeasuredAt)}` : 'Not measured yet'}
            {injury.remeasureDue && open ? <strong className="text-ember-700"> · Re-measure due</strong> : null}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link to={`/injuries/${injury.id}/referral`} className={linkButtonClass.secondary}>
            <FileText aria-hidden className="h-4 w-4" /> Referral summary
          </Link>
          {open ? (
            <Link to={`/runs/new?injuryId=${encodeURIComponent(injury.id)}`} className={linkButtonClass.primary}>
              <Play aria-hidden className="h-4 w-4" /> Start a run
            </Link>
          ) : null}
        </div>
      </header>

      <RedFlagsBanner />

      {operations}

      {/* Columns rather than a grid: the cards differ a lot in height, and rows would leave holes. */}
      <div className="columns-1 gap-4 md:columns-2 xl:columns-3 [&>*]:mb-4 [&>*]:break-inside-avoid">
        <PhaseCard injury={injury} />
        <SeverityCard injury={injury} />
        <ProgressCard injury={injury} />
        <CautionsCard injury={injury} />
        <PadCard injury={injury} />
        <ColdScheduleCard schedule={coldSchedule} phase={injury.phase} />
      </div>

      <section aria-labelledby="measurements-heading" className="flex flex-col gap-4">
        <h2 id="measurements-heading" className="text-xl font-semibold">
          Measurements
        </h2>
        <MeasurementCharts measurements={measurements} />
        {open ? (
          <Card title="Add a measurement" icon={ClipboardList}>
            <MeasurementForm injuryId={injury.id} lastGirth={lastGirth} />
          </Card>
        ) : null}
        <h3 className="text-lg font-semibold">History</h3>
        <MeasurementHistory measurements={measurements} />
      </section>
    </div>
  );
}
