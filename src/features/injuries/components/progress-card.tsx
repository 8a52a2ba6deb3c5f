import { TrendingDown, TrendingUp, Minus, Activity } from 'lucide-react';
import type { InjuryView } from '../../../../shared/records/responses';
import { Card, Source } from './card';

const signed = (n: number, unit: string) => `${n > 0 ? '+' : n < 0 ? '−' : '±'}${Math.abs(n)}${unit}`;

/** Girth and pain change since the previous reading, in words, next to the charts that show the whole course. */
export function ProgressCard({ injury }: { injury: InjuryView }) {
  const { girth, pain } = injury.assessment;
  return (
    <Card title="Since the last measurement" icon={Activity}>
      <div>
        <h3 className="font-semibold">Girth</h3>
        {girth.latest ? (
          <p className="text-sm">
            Latest: injured {girth.latest.injuredCm} cm, other {girth.latest.otherCm} cm (difference {signed(girth.latest.differenceCm, ' cm')})
            {girth.latest.landmark ? `, ${girth.latest.distanceCm ?? '?'} cm from ${girth.latest.landmark}` : ''}.
          </p>
        ) : (
          <p className="text-sm">No girth recorded yet.</p>
        )}
        {girth.changeDifferenceCm !== null ? (
          <p className="mt-1 flex items-center gap-2 text-sm">
            {girth.swellingIncreased ? <TrendingUp aria-hidden className="h-4 w-4 text-ember-700" /> : <Minus aria-hidden className="h-4 w-4" />}
            <span>
              Difference changed by {signed(girth.changeDifferenceCm, ' cm')} (injured side {signed(girth.changeInjuredCm ?? 0, ' cm')}).{' '}
              <strong>{girth.swellingIncreased ? 'Swelling has increased: back to cold and compression.' : 'No increase in swelling.'}</strong>
            </span>
          </p>
        ) : girth.note ? (
          <p className="mt-1 text-sm text-ink-muted">{girth.note}</p>
        ) : null}
        <p className="mt-1 text-xs text-ink-muted">
          Swelling counts as increased above {girth.thresholdCm} cm: {girth.thresholdSource}.
        </p>
      </div>
      <div>
        <h3 className="font-semibold">Pain</h3>
        {pain ? (
          <>
            <p className="flex items-center gap-2 text-sm">
              {pain.direction === 'better' ? <TrendingDown aria-hidden className="h-4 w-4" /> : pain.direction === 'worse' ? <TrendingUp aria-hidden className="h-4 w-4 text-ember-700" /> : <Minus aria-hidden className="h-4 w-4" />}
              <span>
                NPRS {pain.previous} → {pain.latest} ({signed(pain.change, ' points')}
                {pain.percentChange !== null ? `, ${signed(pain.percentChange, ' %')}` : ''}):{' '}
                <strong>
                  {pain.direction === 'unchanged' ? 'unchanged' : pain.direction}
                  {pain.clinicallyImportant ? ', a clinically important change' : ', less than a clinically important change'}
                </strong>
                .
              </span>
            </p>
            <p className="mt-1 text-xs text-ink-muted">{pain.note}</p>
            <Source>{pain.source}</Source>
          </>
        ) : (
          <p className="text-sm">Two pain scores are needed to show a change.</p>
        )}
      </div>
    </Card>
  );
}
