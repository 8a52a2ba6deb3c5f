import type { MeasurementView } from '../../../../shared/records/responses';
import { formatDateTime } from '../lib/time';

const show = (value: number | null, unit = '') => (value === null ? '—' : `${value}${unit}`);

export function MeasurementHistory({ measurements }: { measurements: MeasurementView[] }) {
  if (!measurements.length) return <p className="text-ink-muted">No measurements yet. The first one grades the injury and sizes the pad.</p>;
  // Newest first: the last reading is the one compared against at the table.
  const rows = [...measurements].reverse();
  return (
    <div className="overflow-x-auto rounded-xl bg-paper-raised ring-1 ring-ink/10">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Measurements, newest first</caption>
        <thead className="bg-paper-sunk">
          <tr>
            {['Taken', 'Girth injured / other', 'Difference', 'Girth site', 'Knee flexion', 'Pain (NPRS)', 'Bruise', 'Skinfold', 'Notes', 'By'].map((heading) => (
              <th key={heading} scope="col" className="px-3 py-2 font-semibold">
                {heading}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((m) => (
            <tr key={m.id} className="border-t border-ink/10 align-top">
              <td className="whitespace-nowrap px-3 py-2">{formatDateTime(m.takenAt)}</td>
              <td className="whitespace-nowrap px-3 py-2 tabular-nums">
                {m.girthInjuredCm === null ? '—' : `${m.girthInjuredCm} / ${m.girthOtherCm} cm`}
              </td>
              <td className="whitespace-nowrap px-3 py-2 tabular-nums">
                {m.girthInjuredCm !== null && m.girthOtherCm !== null ? `${Math.round((m.girthInjuredCm - m.girthOtherCm) * 10) / 10} cm` : '—'}
              </td>
              <td className="px-3 py-2">{m.girthLandmark ? `${show(m.girthDistanceCm, ' cm')} from ${m.girthLandmark}` : '—'}</td>
              <td className="px-3 py-2 tabular-nums">{show(m.kneeFlexionDeg, '°')}</td>
              <td className="px-3 py-2 tabular-nums">{show(m.painNprs)}</td>
              <td className="whitespace-nowrap px-3 py-2 tabular-nums">
                {m.bruiseLengthCm === null ? '—' : `${m.bruiseLengthCm} × ${m.bruiseWidthCm} cm`}
              </td>
              <td className="px-3 py-2 tabular-nums">{show(m.skinfoldMm, ' mm')}</td>
              <td className="max-w-[16rem] px-3 py-2">{m.notes ?? ''}</td>
              <td className="px-3 py-2">{m.recordedByName ?? ''}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
