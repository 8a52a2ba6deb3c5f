import type { ReactNode } from 'react';
import { Activity, ChartBar, Download, ListOrdered, Ruler } from 'lucide-react';
import type { ReviewRunDetail } from '../../../../shared/review/responses';
import { MeasurementsCompare, ReviewRunHeader, RunEvents, Section } from './run-detail';
import { RunTimeline } from './run-timeline';

/**
 * One run as the supervisor reviews it. The session note and the full log come from other features, so the
 * route hands them in; the note follows the evidence it is signed against.
 */
export function ReviewRunView({ detail, note, log }: { detail: ReviewRunDetail; note: ReactNode; log: ReactNode }) {
  return (
    <div className="flex flex-col gap-4">
      <ReviewRunHeader detail={detail} />
      <Section title="Timeline: planned against actual" icon={ChartBar}>
        <RunTimeline timeline={detail.timeline} />
      </Section>
      <div className="grid items-start gap-4 lg:grid-cols-2">
        <Section title="Swelling checks, skips and early end" icon={Activity}>
          <RunEvents entries={detail.entries} />
        </Section>
        <Section title="Measurements before and after" icon={Ruler}>
          <MeasurementsCompare before={detail.measurementsBefore} after={detail.measurementsAfter} />
          <a
            href={`/api/injuries/${encodeURIComponent(detail.run.injuryId)}/measurements.csv`}
            download
            className="inline-flex min-h-target items-center gap-2 self-start rounded-lg border border-ink/25 px-4 py-2 font-medium hover:bg-paper-sunk"
          >
            <Download aria-hidden className="h-4 w-4" /> All of this injury’s measurements (CSV)
          </a>
        </Section>
      </div>
      {note}
      <Section title="Every log entry, in order" icon={ListOrdered}>
        {log}
      </Section>
    </div>
  );
}
