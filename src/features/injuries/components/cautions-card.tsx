import { OctagonAlert, ShieldAlert } from 'lucide-react';
import type { InjuryView } from '../../../../shared/records/responses';
import { Card, Source } from './card';

/** Early signs of acute compartment syndrome; any one of them ends treatment here. */
const redFlags = [
  'Pain out of proportion to the injury',
  'Pain on passive stretch of the muscle',
  'Numbness, or pins and needles',
  'A cold, pale limb',
];

/** Always on the injury page, above everything else: these signs end treatment whatever the plan says. */
export function RedFlagsBanner() {
  return (
    <div role="note" aria-label="Red flags" className="rounded-xl border-l-8 border-ember-700 bg-ember-50 p-4">
      <p className="flex items-center gap-2 text-lg font-semibold text-ember-700">
        <OctagonAlert aria-hidden className="h-6 w-6" /> Stop and refer to a physician at once if you find:
      </p>
      <ul className="mt-1 flex flex-wrap gap-x-6 gap-y-1 pl-8 font-medium">
        {redFlags.map((flag) => (
          <li key={flag} className="list-disc">
            {flag}
          </li>
        ))}
      </ul>
      <p className="mt-2 pl-8 text-xs text-ink-muted">
        Signs of acute compartment syndrome; not all need be present. After a thigh contusion it has been reported from 24 hours to 8 days.
        Source: Tintinalli&rsquo;s Emergency Medicine, chapter on compartment syndrome.
      </p>
    </div>
  );
}

export function CautionsCard({ injury }: { injury: InjuryView }) {
  const { risks } = injury;
  return (
    <Card title="Cautions" icon={ShieldAlert}>
      <div>
        <h3 className="font-semibold">Myositis ossificans risk</h3>
        {!risks.applies ? (
          <p className="text-sm">The published risk factors are for thigh contusions; none are assessed for this site.</p>
        ) : risks.factors.length === 0 ? (
          <p className="text-sm">No risk factors recorded so far.</p>
        ) : (
          <ul className="list-disc pl-6 text-sm" aria-label="Risk factors present">
            {risks.factors.map((factor) => (
              <li key={factor.id}>{factor.label}</li>
            ))}
          </ul>
        )}
        {risks.caution ? (
          <div className="mt-2 rounded-lg border-l-4 border-ember-500 bg-ember-50 p-3 text-sm">
            <p className="font-semibold">Caution</p>
            <ul className="list-disc pl-6">
              {risks.caution.lines.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
            <p className="mt-1 text-xs text-ink-muted">Source: {risks.caution.source}</p>
          </div>
        ) : null}
        <p className="mt-1 text-xs text-ink-muted">{risks.note}</p>
        <Source>{risks.source}</Source>
      </div>

      <div>
        <h3 className="font-semibold">Refer to a physician when…</h3>
        <ul className="list-disc pl-6 text-sm">
          <li>local warmth, firmness or swelling does not settle (suspected myositis ossificans: refer for imaging);</li>
          <li>swelling keeps increasing despite cold and compression;</li>
          <li>a fracture is suspected, or the skin is broken over the site;</li>
          <li>the athlete takes anticoagulants or has a bleeding disorder: ask their physician before massage.</li>
        </ul>
        <Source>Phys Sportsmed 1995;23(2):77–82 (title not retrieved) for myositis ossificans; rehabilitation texts, common practice, for the rest</Source>
      </div>
    </Card>
  );
}
