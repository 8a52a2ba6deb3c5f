import { Snowflake, Sprout, Waves } from 'lucide-react';
import type { Phase } from '../../../../shared/phase';

const phaseLook: Record<Phase, { word: string; Icon: typeof Snowflake; className: string }> = {
  acute: { word: 'Acute', Icon: Snowflake, className: 'border-phase-acute text-phase-acute' },
  proliferative: { word: 'Proliferative', Icon: Sprout, className: 'border-phase-proliferative text-phase-proliferative' },
  remodelling: { word: 'Remodelling', Icon: Waves, className: 'border-phase-remodelling text-phase-remodelling' },
};

/** The phase as a word and an icon; the colour only repeats them. */
export function PhaseBadge({ phase, tone = 'light' }: { phase: Phase; tone?: 'light' | 'dark' }) {
  const { word, Icon, className } = phaseLook[phase];
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full border-2 px-3 py-1 text-sm font-semibold ${className} ${tone === 'dark' ? 'bg-slate-900' : 'bg-paper-raised'}`}>
      <Icon aria-hidden className="h-4 w-4" />
      {word}
    </span>
  );
}
