import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

/*
 * The select, text-area and checkbox twins of components/ui/text-field: label above, hint and error below,
 * tied to the control with aria-describedby.
 */

function describedBy(id: string, error?: string, hint?: string) {
  return [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(' ') || undefined;
}

function HintAndError({ id, hint, error }: { id: string; hint?: string; error?: string }) {
  return (
    <>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-ember-700">
          {error}
        </p>
      ) : null}
    </>
  );
}

const controlClass = (error?: string) =>
  `min-h-target rounded-lg border bg-paper-raised px-3 py-2 text-base text-ink ${error ? 'border-ember-600' : 'border-ink/30'}`;

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string; hint?: string; children: ReactNode };

export const SelectField = forwardRef<HTMLSelectElement, SelectProps>(function SelectField({ label, error, hint, className = '', children, ...props }, ref) {
  const id = useId();
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-medium">
        {label}
      </label>
      <select ref={ref} id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, error, hint)} className={controlClass(error)} {...props}>
        {children}
      </select>
      <HintAndError id={id} hint={hint} error={error} />
    </div>
  );
});

type TextAreaProps = TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; error?: string; hint?: string };

export const TextAreaField = forwardRef<HTMLTextAreaElement, TextAreaProps>(function TextAreaField({ label, error, hint, className = '', rows = 2, ...props }, ref) {
  const id = useId();
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-medium">
        {label}
      </label>
      <textarea ref={ref} id={id} rows={rows} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, error, hint)} className={controlClass(error)} {...props} />
      <HintAndError id={id} hint={hint} error={error} />
    </div>
  );
});

type CheckboxProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & { label: string; hint?: string };

export const CheckboxField = forwardRef<HTMLInputElement, CheckboxProps>(function CheckboxField({ label, hint, className = '', ...props }, ref) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="inline-flex min-h-target cursor-pointer items-center gap-3 rounded-lg px-1 font-medium">
        <input ref={ref} id={id} type="checkbox" aria-describedby={hint ? `${id}-hint` : undefined} className="h-6 w-6 accent-ink" {...props} />
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="pl-10 text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
});

/** A link dressed as a button, for actions that go to another screen. */
export const linkButtonClass = {
  primary: 'inline-flex min-h-target items-center justify-center gap-2 rounded-lg bg-ink px-4 py-2 font-medium text-paper hover:bg-ink-soft',
  secondary: 'inline-flex min-h-target items-center justify-center gap-2 rounded-lg border border-ink/25 bg-paper-raised px-4 py-2 font-medium text-ink hover:bg-paper-sunk',
} as const;
