import { forwardRef, useId, type InputHTMLAttributes } from 'react';

type Props = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: string; unit?: string };

/** A labelled input with its unit and its error right beside it. */
export const TextField = forwardRef<HTMLInputElement, Props>(function TextField({ label, error, hint, unit, id, className = '', ...props }, ref) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const describedBy = [error ? `${inputId}-error` : null, hint ? `${inputId}-hint` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={inputId} className="text-sm font-medium text-ink">
        {label}
        {unit ? <span className="ml-1 font-normal text-ink-muted">({unit})</span> : null}
      </label>
      <input
        ref={ref}
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`min-h-target rounded-lg border bg-paper-raised px-3 py-2 text-base text-ink ${error ? 'border-ember-600' : 'border-ink/30'}`}
        {...props}
      />
      {hint ? (
        <p id={`${inputId}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${inputId}-error`} role="alert" className="text-sm font-medium text-ember-700">
          {error}
        </p>
      ) : null}
    </div>
  );
});
