import { useEffect, useRef, useState } from 'react';
import { Waves } from 'lucide-react';

export const SWELLING_CONFIRM_WINDOW_MS = 3000;
export const SWELLING_HOLD_MS = 800;

/**
 * "Swelling has increased": a second tap within three seconds, or a hold, confirms — a brush of an arm
 * does not send the run back to cold. `armedExternally` lets the keyboard (S, then S) share the same state.
 */
export function SwellingButton({ onConfirm, disabled, label }: { onConfirm: () => void; disabled?: boolean; label: string }) {
  const [armed, setArmed] = useState(false);
  const disarmTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const holdTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const held = useRef(false);

  useEffect(
    () => () => {
      if (disarmTimer.current) clearTimeout(disarmTimer.current);
      if (holdTimer.current) clearTimeout(holdTimer.current);
    },
    [],
  );

  const confirm = () => {
    setArmed(false);
    if (disarmTimer.current) clearTimeout(disarmTimer.current);
    onConfirm();
  };

  const tap = () => {
    if (held.current) {
      held.current = false;
      return;
    }
    if (armed) return confirm();
    setArmed(true);
    disarmTimer.current = setTimeout(() => setArmed(false), SWELLING_CONFIRM_WINDOW_MS);
  };

  return (
    <button
      type="button"
      disabled={disabled}
      onClick={tap}
      onPointerDown={() => {
        held.current = false;
        holdTimer.current = setTimeout(() => {
          held.current = true;
          confirm();
        }, SWELLING_HOLD_MS);
      }}
      onPointerUp={() => holdTimer.current && clearTimeout(holdTimer.current)}
      onPointerLeave={() => holdTimer.current && clearTimeout(holdTimer.current)}
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
