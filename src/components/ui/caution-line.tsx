import { clinicalCaution } from '../../../shared/safety/caution';

/** The shared caution line; `tone` fits it to the dark table screen or the white referral sheet. */
export function CautionLine({ tone = 'light', className = '' }: { tone?: 'light' | 'dark'; className?: string }) {
  const colour = tone === 'dark' ? 'text-slate-300' : 'text-black/70';
  return (
    <p data-testid="clinical-caution" className={`${colour} ${className}`}>
      {clinicalCaution}
    </p>
  );
}
