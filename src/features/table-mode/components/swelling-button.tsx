import { Waves } from 'lucide-react';
import type { SwellingConfirm } from '../hooks/use-swelling-confirm';

/**
 * "Swelling has increased": a second tap within the window, or a hold, confirms — a brush of an arm does not
 * send the run back to cold. The rule and its state come from useSwellingConfirm, shared with the keyboard.
 */
export function SwellingButton({ confirm, disabled, label }: { confirm: SwellingConfirm; disabled?: boolean; label: string }) {
  const { armed } = confirm;
  const tap = () => {
    if (confirm.consumeHold()) return;
    confirm.press();
  };

  return (
    <button
      type="button"
      disabled={disabled}
      onClick={tap}
      onPointerDown={confirm.holdStart}
      onPointerUp={confirm.holdEnd}
      onPointerLeave={confirm.holdEnd}
      aria-describedby="swelling-hint"
      className={`flex min-h-[88px] w-full items-center justify-center gap-3 rounded-2xl border-4 px-6 text-2xl font-bold transition-colors disabled:opacity-40 ${
        armed ? 'border-amber-300 bg-amber-300 text-slate-950' : 'border-amber-300 bg-slate-900 text-amber-200'
      }`}
    >
      <Waves aria-hidden className="h-9 w-9" />
      {armed ? 'Tap again to confirm' : label}
      <span id="swelling-hint" className="sr-only">
        Tap twice or hold to confirm.
      </span>
    </button>
  );
}
