import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { AdherenceFigures, AdherenceReport } from '../../../../shared/review/responses';
import { useAdherence } from '../api/get-adherence';
import { formatDay, formatInstantDay, formatShare } from '../lib/format';

type Rate = { id: string; title: string; colour: string; value: (f: AdherenceFigures) => number | null; counts: (f: AdherenceFigures) => [number, number]; unit: string; aim: string };

const rates: Rate[] = [
  {
    id: 'ice',
    title: 'Ice massage within 5–7 min',
    colour: '#1f5a92',
    value: (f) => f.iceMassageShare,
    counts: (f) => [f.iceMassageWithinBounds, f.iceMassageSteps],
    unit: 'ice-massage steps',
    aim: 'Higher is better. 5–7 min at a time is common practice.',
  },
  {
    id: 'fallback',
    title: 'Runs that fell back to cold',
    colour: '#a54416',
    value: (f) => (f.runs ? f.fallbackRate : null),
    counts: (f) => [f.fallbacks, f.runs],
    unit: 'runs',
    aim: 'Swelling that rose during a run; each one deserves a look.',
  },
  {
    id: 'skipped',
    title: 'Steps skipped',
    colour: '#c98a12',
    value: (f) => (f.totalSteps ? f.skippedRate : null),
    counts: (f) => [f.skippedSteps, f.totalSteps],
    unit: 'steps',
    aim: 'Each skip carries the therapist’s reason in the run’s log.',
  },
];

function RateChart({ rate, report }: { rate: Rate; report: AdherenceReport }) {
  const data = report.therapists.map((t) => ({ name: t.name, percent: rate.value(t) === null ? 0 : Math.round((rate.value(t) ?? 0) * 100) }));
  return (
    <figure className="flex flex-col gap-2 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10" aria-labelledby={`rate-${rate.id}`}>
      <h3 id={`rate-${rate.id}`} className="font-semibold">
        {rate.title}
      </h3>
      <p className="text-3xl font-semibold tabular-nums">{formatShare(rate.value(report.clinic))}</p>
      <p className="text-sm text-ink-muted">
        Clinic: {rate.counts(report.clinic).join(' of ')} {rate.unit}. {rate.aim}
      </p>
      {/* The bars repeat the table below, which carries the same numbers for screen readers. */}
      {data.length ? (
        <div aria-hidden className="h-36 w-full">
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -20 }}>
              <CartesianGrid stroke="#ece8dc" vertical={false} />
              <XAxis dataKey="name" tick={{ fontSize: 11, fill: '#58716d' }} interval={0} />
              <YAxis domain={[0, 100]} ticks={[0, 50, 100]} unit="%" tick={{ fontSize: 11, fill: '#58716d' }} />
              <Tooltip formatter={(v) => [`${String(v)} %`, rate.title]} />
              <Bar dataKey="percent" fill={rate.colour} isAnimationActive={false} maxBarSize={36} />
            </BarChart>
          </ResponsiveContainer>
        </div>
      ) : null}
    </figure>
  );
}

/**
 * How closely the clinic kept to its protocol over the chosen dates, for the clinic and for each therapist.
 * The server answers with instants (its end is exclusive), so the heading names the days as they were chosen;
 * without a start it covers the four weeks before the end.
 */
export function AdherencePanel({ from, to }: { from?: string; to?: string }) {
  const adherence = useAdherence({ from, to });
  if (adherence.isPending) return <p className="text-ink-muted">Loading adherence…</p>;
  if (adherence.isError) return <p className="text-ember-700">{adherence.error.message}</p>;
  const report = adherence.data;
  const { clinic } = report;
  const phasesLine = `${clinic.runsPerPhase.acute} acute · ${clinic.runsPerPhase.proliferative} proliferative · ${clinic.runsPerPhase.remodelling} remodelling`;

  return (
    <section aria-labelledby="adherence-heading" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="adherence-heading" className="text-xl font-semibold">
          Adherence, {from ? formatDay(from) : formatInstantDay(report.from)} – {to ? formatDay(to) : 'now'}
        </h2>
        <p className="text-sm text-ink-muted">
          {clinic.runs} {clinic.runs === 1 ? 'run' : 'runs'}: {phasesLine}
        </p>
      </div>
      <div className="grid gap-3 md:grid-cols-3">
        {rates.map((rate) => (
          <RateChart key={rate.id} rate={rate} report={report} />
        ))}
      </div>
      <div className="overflow-x-auto rounded-xl bg-paper-raised ring-1 ring-ink/10">
        <table className="w-full text-left text-sm">
          <caption className="px-4 pt-3 text-left font-semibold">Per therapist</caption>
          <thead>
            <tr className="border-b border-ink/10">
              <th scope="col" className="px-4 py-2">Therapist</th>
              <th scope="col" className="px-4 py-2">Runs</th>
              <th scope="col" className="px-4 py-2">Acute / prolif. / remod.</th>
              <th scope="col" className="px-4 py-2">Ice massage within 5–7 min</th>
              <th scope="col" className="px-4 py-2">Fell back</th>
              <th scope="col" className="px-4 py-2">Steps skipped</th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {[...report.therapists, { ...clinic, therapistId: 'clinic', name: 'Whole clinic' }].map((t) => (
              <tr key={t.therapistId} className={`border-t border-ink/10 ${t.therapistId === 'clinic' ? 'font-semibold' : ''}`}>
                <th scope="row" className="px-4 py-2 font-medium">{t.name}</th>
                <td className="px-4 py-2">{t.runs}</td>
                <td className="px-4 py-2">
                  {t.runsPerPhase.acute} / {t.runsPerPhase.proliferative} / {t.runsPerPhase.remodelling}
                </td>
                {rates.map((rate) => (
                  <td key={rate.id} className="px-4 py-2">
                    {formatShare(rate.value(t))} <span className="font-normal text-ink-muted">({rate.counts(t).join(' of ')})</span>
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
