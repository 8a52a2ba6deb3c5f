import type { ReactNode } from 'react';
import type { LucideIcon } from 'lucide-react';

/** The signed-out pages' frame (as sign-in): one card in the middle of the screen. */
export function AuthCard({ title, intro, children }: { title: string; intro?: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-paper px-4">
      <div className="w-full max-w-md rounded-2xl bg-paper-raised p-8 shadow-sm ring-1 ring-ink/10">
        <p className="text-sm font-semibold uppercase tracking-wide text-ink-muted">Mendstep</p>
        <h1 className="mt-1 text-3xl font-bold tracking-tight">{title}</h1>
        {intro ? <p className="mb-6 mt-1 text-ink-muted">{intro}</p> : <div className="mb-6" />}
        {children}
      </div>
    </main>
  );
}

export const textLinkClass = 'inline-flex min-h-target items-center font-medium underline underline-offset-4';
export const primaryLinkClass = 'inline-flex min-h-target items-center justify-center rounded-lg bg-ink px-4 py-2 font-medium text-paper hover:bg-ink-soft';

/** A done-and-what-next message, said by its title and icon as well as its colour. */
export function SuccessNote({ icon: Icon, title, children }: { icon: LucideIcon; title: string; children: ReactNode }) {
  return (
    <div role="status" className="flex gap-3 rounded-lg border-l-4 border-moss-500 bg-moss-50 p-3">
      <Icon aria-hidden className="mt-0.5 h-5 w-5 shrink-0" />
      <div>
        <p className="font-semibold">{title}</p>
        <p className="text-sm">{children}</p>
      </div>
    </div>
  );
}
