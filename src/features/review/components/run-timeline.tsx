import { Bar, BarChart, CartesianGrid, Cell, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { CircleCheck, CircleDashed, CircleStop, SkipForward, TimerOff, Undo2 } from 'lucide-react';
import { isWithinBounds, stepKinds, stepKindInfo, type StepKind } from '../../../../shared/plan/step-kinds';
import type { TimelineStep } from '../../../../shared/review/responses';
import { formatClock, formatSeconds } from '../lib/format';
import { Badge } from './status-badges';

const resultLook = {
  completed: { word: 'Completed', Icon: CircleCheck, tone: 'good' },
  skipped: { word: 'Skipped', Icon: SkipForward, tone: 'warn' },
  interrupted: { word: 'Interrupted', Icon: CircleStop, tone: 'alert' },
  'not-reached': { word: 'Not reached', Icon: CircleDashed, tone: 'quiet' },
} as const;

const isKind = (kind: string): kind is StepKind => (stepKinds as readonly string[]).includes(kind);

/** A completed step that ran outside its kind's safety bounds (ice massage outside 5–7 min, common practice, among them). */
export function outsideBounds(step: TimelineStep): boolean {
  return step.result === 'completed' && step.actualSeconds !== null && isKind(step.kind) && !isWithinBounds(step.kind, step.actualSeconds);
}

// Rows come in the order they happened (steps never reached last), so the row number is the order on the table.
const stepName = (step: TimelineStep, row: number) => `${row + 1}. ${step.label}${step.stage === 'back-to-cold' ? ' ↩' : ''}`;

const colours = { planned: '#c9d3d1', actual: '#12332f', backToCold: '#2a6fb0', outside: '#a54416' };

/** Planned against actual time per step, drawn and then written out, with back-to-cold steps marked in both. */
export function RunTimeline({ timeline }: { timeline: TimelineStep[] }) {
  if (timeline.length === 0) return <p className="text-ink-muted">This run has no steps: it stopped before table mode.</p>;
  const data = timeline.map((step, row) => ({
    name: stepName(step, row),
    planned: Math.round((step.plannedSeconds / 60) * 10) / 10,
    actual: step.actualSeconds === null ? 0 : Math.round((step.actualSeconds / 60) * 10) / 10,
    step,
  }));

  return (
    <div className="flex flex-col gap-3">
      <div aria-hidden className="w-full" style={{ height: 48 + timeline.length * 40 }}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={data} layout="vertical" margin={{ top: 4, right: 16, bottom: 4, left: 8 }} barGap={2}>
            <CartesianGrid stroke="#ece8dc" horizontal={false} />
            <XAxis type="number" unit=" min" tick={{ fontSize: 12, fill: '#58716d' }} allowDecimals={false} />
            <YAxis type="category" dataKey="name" width={230} tick={{ fontSize: 13, fill: '#12332f' }} />
            <Tooltip formatter={(v, name) => [`${String(v)} min`, name === 'planned' ? 'Planned' : 'Actual']} />
            <Legend formatter={(name) => <span className="text-ink">{name === 'planned' ? 'Planned' : 'Actual (blue: back to cold; rust: outside its bounds)'}</span>} />
            <Bar dataKey="planned" fill={colours.planned} isAnimationActive={false} barSize={12} />
            <Bar dataKey="actual" fill={colours.actual} isAnimationActive={false} barSize={12}>
              {data.map((d) => (
                <Cell key={d.name} fill={outsideBounds(d.step) ? colours.outside : d.step.stage === 'back-to-cold' ? colours.backToCold : colours.actual} />
              ))}
            </Bar>
          </BarChart>
        </ResponsiveContainer>
      </div>
      <p className="text-sm text-ink-muted">↩ marks steps added when the run went back to cold. The same figures follow in the table.</p>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm" aria-label="Timeline: planned and actual time per step">
          <thead>
            <tr className="border-b border-ink/15">
              <th scope="col" className="px-3 py-2">Step</th>
              <th scope="col" className="px-3 py-2">Stage</th>
              <th scope="col" className="px-3 py-2">Started</th>
              <th scope="col" className="px-3 py-2">Planned</th>
              <th scope="col" className="px-3 py-2">Actual</th>
              <th scope="col" className="px-3 py-2">Result</th>
              <th scope="col" className="px-3 py-2">Reason</th>
            </tr>
          </thead>
          <tbody>
            {timeline.map((step, row) => (
              <tr key={row} className="border-t border-ink/10" data-testid="timeline-row">
                <th scope="row" className="px-3 py-2 font-medium">
                  {stepName(step, row).replace(' ↩', '')}
                </th>
                <td className="px-3 py-2">
                  {step.stage === 'back-to-cold' ? (
                    <span className="inline-flex items-center gap-1 font-medium text-tide-700">
                      <Undo2 aria-hidden className="h-4 w-4" /> Back to cold
                    </span>
                  ) : (
                    'Plan'
                  )}
                </td>
                <td className="px-3 py-2 tabular-nums">{step.startedAt ? formatClock(step.startedAt) : '—'}</td>
                <td className="px-3 py-2 tabular-nums">{formatSeconds(step.plannedSeconds)}</td>
                <td className="px-3 py-2 tabular-nums">{step.actualSeconds === null ? '—' : formatSeconds(step.actualSeconds)}</td>
                <td className="px-3 py-2">
                  <span className="flex flex-wrap gap-1">
                    <Badge look={resultLook[step.result]} />
                    {outsideBounds(step) && isKind(step.kind) ? (
                      <Badge look={{ word: `Outside ${formatSeconds(stepKindInfo[step.kind].bounds.min)}–${formatSeconds(stepKindInfo[step.kind].bounds.max)}`, Icon: TimerOff, tone: 'alert' }} />
                    ) : null}
                  </span>
                </td>
                <td className="px-3 py-2">{step.reason ?? ''}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
