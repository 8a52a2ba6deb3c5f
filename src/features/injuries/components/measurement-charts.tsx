import { useState } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { MeasurementView } from '../../../../shared/records/responses';
import { formatShortDateTime } from '../lib/time';

type Bound = number | ((value: number) => number);

interface Series {
  id: string;
  title: string;
  unit: string;
  colour: string;
  domain: [Bound, Bound];
  reference?: { y: number; label?: string };
  ticks?: number[];
  caption: string;
  value: (m: MeasurementView) => number | null;
}

// Rounded like the server's girth summary: a tape reads to the millimetre.
const girthDifference = (m: MeasurementView) =>
  m.girthInjuredCm !== null && m.girthOtherCm !== null ? Math.round((m.girthInjuredCm - m.girthOtherCm) * 10) / 10 : null;

const series: Series[] = [
  {
    id: 'girth',
    title: 'Girth difference, injured − other side',
    unit: 'cm',
    colour: '#1f5a92',
    // Zero stays in view so "equal girth" is always there to read against; whole centimetres keep ticks plain.
    domain: [(min) => Math.min(0, Math.floor(min)), (max) => Math.max(1, Math.ceil(max))],
    reference: { y: 0 },
    caption: 'Above 0 the injured limb is larger. A falling line means swelling is going down.',
    value: girthDifference,
  },
  {
    id: 'flexion',
    title: 'Knee flexion, active',
    unit: '°',
    colour: '#236648',
    domain: [0, 160],
    reference: { y: 120, label: '120°' },
    caption: 'Dashed line: 120°. Knee flexion below it was a risk factor for myositis ossificans (Ryan et al. 1991).',
    value: (m) => m.kneeFlexionDeg,
  },
  {
    id: 'pain',
    title: 'Pain, NPRS',
    unit: '/10',
    colour: '#a54416',
    domain: [0, 10],
    ticks: [0, 2, 4, 6, 8, 10],
    caption: 'A change of about 2 points or 30 % was clinically important in chronic pain (Farrar et al. 2001).',
    value: (m) => m.painNprs,
  },
];

export function MeasurementCharts({ measurements }: { measurements: MeasurementView[] }) {
  return (
    <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
      {series.map((s) => (
        <SeriesChart key={s.id} series={s} measurements={measurements} />
      ))}
    </div>
  );
}

function SeriesChart({ series: s, measurements }: { series: Series; measurements: MeasurementView[] }) {
  const points = measurements.flatMap((m) => {
    const value = s.value(m);
    return value === null ? [] : [{ t: Date.parse(m.takenAt), takenAt: m.takenAt, value }];
  });
  const titleId = `chart-${s.id}-title`;
  const [showNumbers, setShowNumbers] = useState(false);

  return (
    <figure className="flex flex-col gap-2 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10" aria-labelledby={titleId}>
      <h3 id={titleId} className="font-semibold">
        {s.title} <span className="font-normal text-ink-muted">({s.unit})</span>
      </h3>
      {points.length === 0 ? (
        <p className="text-sm text-ink-muted">No readings yet.</p>
      ) : (
        // The drawing is for the eye; the same numbers follow in a table for screen readers.
        <div aria-hidden className="h-48 w-full">
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={points} margin={{ top: 8, right: 12, bottom: 0, left: -12 }}>
              <CartesianGrid stroke="#ece8dc" />
              <XAxis
                dataKey="t"
                type="number"
                scale="time"
                domain={points.length > 1 ? ['dataMin', 'dataMax'] : [points[0].t - 3_600_000, points[0].t + 3_600_000]}
                tickFormatter={(t: number) => formatShortDateTime(t)}
                tick={{ fontSize: 11, fill: '#58716d' }}
                tickCount={3}
              />
              <YAxis domain={s.domain} ticks={s.ticks} tick={{ fontSize: 11, fill: '#58716d' }} allowDecimals={s.id === 'girth'} />
              {s.reference ? (
                <ReferenceLine y={s.reference.y} stroke="#58716d" strokeDasharray="4 4" label={s.reference.label ? { value: s.reference.label, position: 'insideTopRight', fontSize: 11, fill: '#58716d' } : undefined} />
              ) : null}
              <Tooltip labelFormatter={(t) => formatShortDateTime(Number(t))} formatter={(v) => [`${String(v)} ${s.unit}`, s.title]} />
              <Line type="monotone" dataKey="value" stroke={s.colour} strokeWidth={2.5} dot={{ r: 4, fill: s.colour }} isAnimationActive={false} />
            </LineChart>
          </ResponsiveContainer>
        </div>
      )}
      <p className="text-xs text-ink-muted">{s.caption}</p>
      {points.length ? (
        <>
          <button
            type="button"
            className="inline-flex min-h-target items-center self-start rounded-md text-sm font-medium underline underline-offset-4 hover:bg-paper-sunk"
            aria-expanded={showNumbers}
            onClick={() => setShowNumbers((v) => !v)}
          >
            {showNumbers ? 'Hide the numbers' : 'Show the numbers'}
          </button>
          {/* Always in the page for screen readers; on screen only when asked for. */}
          <table className={showNumbers ? 'w-full text-left text-sm' : 'sr-only'}>
            <caption className="sr-only">{s.title}, by time of measurement</caption>
            <thead>
              <tr>
                <th scope="col" className="py-1 pr-2 font-semibold">
                  Taken
                </th>
                <th scope="col" className="py-1 font-semibold">
                  {s.title} ({s.unit})
                </th>
              </tr>
            </thead>
            <tbody>
              {points.map((p) => (
                <tr key={p.takenAt} className="border-t border-ink/10">
                  <td className="py-1 pr-2">{formatShortDateTime(p.takenAt)}</td>
                  <td className="py-1 tabular-nums">{p.value}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      ) : null}
    </figure>
  );
}
