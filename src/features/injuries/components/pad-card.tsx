import { Bandage } from 'lucide-react';
import type { InjuryView } from '../../../../shared/records/responses';
import { Card, Source } from './card';

/** Each line names its source briefly; the full references follow the list once. */
function shortSource(source: string) {
  if (source.startsWith('NHS inform')) return 'NHS inform';
  if (source.startsWith('common practice')) return 'common practice';
  return source;
}

export function PadCard({ injury }: { injury: InjuryView }) {
  const pad = injury.assessment.padSize;
  return (
    <Card title="Compression" icon={Bandage}>
      {pad ? (
        <>
          <p className="text-lg" data-testid="pad-size">
            Felt pad <strong>{pad.length.minCm}–{pad.length.maxCm} cm</strong> long × <strong>{pad.width.minCm}–{pad.width.maxCm} cm</strong> wide
          </p>
          <p className="text-sm text-ink-muted">{pad.note}</p>
          <Source>{pad.source}</Source>
          <h3 className="font-semibold">Wrapping</h3>
          <ol className="list-decimal space-y-1 pl-6 text-sm">
            {pad.wrapGuidance.map((line) => (
              <li key={line.text}>
                {line.text} <span className="text-xs text-ink-muted">({line.source.split('; ').map(shortSource).join('; ')})</span>
              </li>
            ))}
          </ol>
          <Source>{[...new Set(pad.wrapGuidance.flatMap((line) => line.source.split('; ')))].join('; ')}</Source>
        </>
      ) : (
        <p>Record the bruise length and width to size the felt pad (two to three times the bruise, common practice).</p>
      )}
    </Card>
  );
}
