import { useId, useState } from 'react';

/** A large-target sheet to pick or type a reason (skip, finish early) or choose a red flag. */
export function ReasonSheet({
  title,
  choices,
  allowOther,
  confirmLabel,
  danger,
  onChoose,
  onCancel,
}: {
  title: string;
  choices: { value: string; label: string }[];
  allowOther: boolean;
  confirmLabel: string;
  danger?: boolean;
  onChoose: (value: string) => void;
  onCancel: () => void;
}) {
  const [picked, setPicked] = useState<string | null>(null);
  const [other, setOther] = useState('');
  const titleId = useId();
  const value = picked === '__other' ? other.trim() : picked;

  return (
    <div className="fixed inset-0 z-20 flex items-end justify-center bg-black/70 p-4 sm:items-center" role="dialog" aria-modal="true" aria-labelledby={titleId}>
      <div className="w-full max-w-2xl rounded-2xl bg-slate-800 p-6 text-paper shadow-xl">
        <h2 id={titleId} className="mb-4 text-2xl font-bold">
          {title}
        </h2>
        <div className="grid gap-2 sm:grid-cols-2">
          {choices.map((choice) => (
            <button
              key={choice.value}
              type="button"
              aria-pressed={picked === choice.value}
              onClick={() => setPicked(choice.value)}
              className={`min-h-table-target rounded-xl border-2 px-4 text-left text-lg ${picked === choice.value ? 'border-paper bg-slate-700 font-semibold' : 'border-slate-700'}`}
            >
              {choice.label}
            </button>
          ))}
          {allowOther ? (
            <button
              type="button"
              aria-pressed={picked === '__other'}
              onClick={() => setPicked('__other')}
              className={`min-h-table-target rounded-xl border-2 px-4 text-left text-lg ${picked === '__other' ? 'border-paper bg-slate-700 font-semibold' : 'border-slate-700'}`}
            >
              Another reason…
            </button>
          ) : null}
        </div>
        {picked === '__other' ? (
          <label className="mt-3 flex flex-col gap-1">
            <span>Reason</span>
            <input autoFocus value={other} onChange={(e) => setOther(e.target.value)} maxLength={500} className="min-h-table-target rounded-xl bg-slate-950 px-4 text-lg text-paper ring-1 ring-slate-700" />
          </label>
        ) : null}
        <div className="mt-6 flex flex-wrap justify-end gap-3">
          <button type="button" onClick={onCancel} className="min-h-table-target rounded-xl px-6 text-lg ring-1 ring-slate-600">
            Cancel
          </button>
          <button
            type="button"
            disabled={!value}
            onClick={() => value && onChoose(value)}
            className={`min-h-table-target rounded-xl px-6 text-lg font-semibold disabled:opacity-40 ${danger ? 'bg-red-500 text-white' : 'bg-paper text-slate-950'}`}
          >
            {confirmLabel}
          </button>
        </div>
      </div>
    </div>
  );
}
