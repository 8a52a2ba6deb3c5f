import type { ReactNode } from 'react';
import { AlertTriangle, Info } from 'lucide-react';

/** A message box whose kind is said by an icon and a word, not only by colour. */
export function Notice({ kind = 'info', title, children }: { kind?: 'info' | 'caution' | 'error'; title?: string; children: ReactNode }) {
  const styles = {
    info: 'border-tide-500 bg-tide-50',
    caution: 'border-ember-500 bg-ember-50',
    error: 'border-ember-700 bg-ember-50',
  }[kind];
  const Icon = kind === 'info' ? Info : AlertTriangle;
  const word = { info: 'Note', caution: 'Caution', error: 'Error' }[kind];
  return (
    <div role={kind === 'error' ? 'alert' : 'note'} className={`flex gap-3 rounded-lg border-l-4 p-3 ${styles}`}>
      <Icon aria-hidden className="mt-0.5 h-5 w-5 shrink-0" />
      <div>
        <p className="font-semibold">{title ?? word}</p>
        <div className="text-sm">{children}</div>
      </div>
    </div>
  );
}
