import type { ReactNode } from 'react';
import type { LucideIcon } from 'lucide-react';

/** A titled panel of the injury page; the title is a heading so screen-reader users can jump between cards. */
export function Card({ title, icon: Icon, children, className = '', actions }: { title: string; icon?: LucideIcon; children: ReactNode; className?: string; actions?: ReactNode }) {
  return (
    <section className={`flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10 ${className}`} aria-label={title}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="flex items-center gap-2 text-lg font-semibold">
          {Icon ? <Icon aria-hidden className="h-5 w-5 text-ink-soft" /> : null}
          {title}
        </h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

/** Where a figure comes from, in small print under it. */
export function Source({ children }: { children: ReactNode }) {
  return <p className="text-xs text-ink-muted">Source: {children}</p>;
}
