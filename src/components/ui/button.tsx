import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';

const variants: Record<Variant, string> = {
  primary: 'bg-ink text-paper hover:bg-ink-soft disabled:bg-ink-muted',
  secondary: 'bg-paper-raised text-ink border border-ink/25 hover:bg-paper-sunk',
  danger: 'bg-ember-600 text-white hover:bg-ember-700',
  ghost: 'text-ink hover:bg-paper-sunk',
};

export function Button({ variant = 'primary', className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type="button"
      className={`inline-flex min-h-target min-w-target items-center justify-center gap-2 rounded-lg px-4 py-2 font-medium transition-colors disabled:cursor-not-allowed ${variants[variant]} ${className}`}
      {...props}
    />
  );
}
