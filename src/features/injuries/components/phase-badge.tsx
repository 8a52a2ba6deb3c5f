import { Dumbbell, Snowflake, Sprout, type LucideIcon } from 'lucide-react';
import type { Phase } from '../../../../shared/phase';

/** Each phase has a word, an icon and an accent: the colour is never the only sign. */
export const phaseDisplay: Record<Phase, { word: string; Icon: LucideIcon; accent: string }> = {
  acute: { word: 'Acute', Icon: Snowflake, accent: 'border-phase-acute bg-phase-acute/15' },
  proliferative: { word: 'Proliferative', Icon: Sprout, accent: 'border-phase-proliferative bg-phase-proliferative/15' },
  remodelling: { word: 'Remodelling', Icon: Dumbbell, accent: 'border-phase-remodelling bg-phase-remodelling/15' },
};

export function PhaseBadge({ phase, size = 'md' }: { phase: Phase; size?: 'md' | 'lg' }) {
  const { word, Icon, accent } = phaseDisplay[phase];
  const sizing = size === 'lg' ? 'px-3 py-1 text-lg gap-2' : 'px-2.5 py-0.5 text-sm gap-1.5';
  return (
    <span className={`inline-flex items-center rounded-full border-2 font-semibold text-ink ${accent} ${sizing}`}>
      <Icon aria-hidden className={size === 'lg' ? 'h-5 w-5' : 'h-4 w-4'} />
      {word}
      <span className="sr-only"> phase</span>
    </span>
  );
}
