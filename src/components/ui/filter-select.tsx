import { useId, type ReactNode } from 'react';

/** A labelled select for list filters; the empty option means "no filter" and is reported as undefined. */
export function FilterSelect({ label, value, onChange, children }: { label: string; value: string | undefined; onChange: (value: string | undefined) => void; children: ReactNode }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium">
        {label}
      </label>
      <select id={id} value={value ?? ''} onChange={(e) => onChange(e.target.value || undefined)} className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2">
        {children}
      </select>
    </div>
  );
}
