import { useCallback, useEffect, useRef, useState } from 'react';

/**
 * "Swelling has increased" sends the run back to cold, so one touch or key press never does it: a second
 * press within the window, or a hold, confirms. The keyboard (S, then S) and the on-screen control share one
 * instance of this rule, and a first press expires after the window. The window and hold times are ours
 * (decision record 0101): long enough for a therapist with a hand on the limb, short enough that a stray
 * press is forgotten.
 */
export const SWELLING_CONFIRM_WINDOW_MS = 3000;
export const SWELLING_HOLD_MS = 800;

export interface SwellingConfirm {
  /** A first press arms the control until the window ends; a second press within it confirms. */
  armed: boolean;
  press: () => void;
  /** Start and end of a hold on the on-screen control; a hold of SWELLING_HOLD_MS confirms. */
  holdStart: () => void;
  holdEnd: () => void;
  /** A hold confirmed; the click that follows the pointer's release must not arm the control again. */
  consumeHold: () => boolean;
}

export function useSwellingConfirm(onConfirm: () => void): SwellingConfirm {
  const [armed, setArmed] = useState(false);
  const armedRef = useRef(false);
  const disarmTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const holdTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const held = useRef(false);
  const confirmRef = useRef(onConfirm);
  confirmRef.current = onConfirm;

  const setArmedBoth = useCallback((value: boolean) => {
    armedRef.current = value;
    setArmed(value);
  }, []);

  const disarm = useCallback(() => {
    if (disarmTimer.current) clearTimeout(disarmTimer.current);
    disarmTimer.current = null;
    setArmedBoth(false);
  }, [setArmedBoth]);

  const confirm = useCallback(() => {
    disarm();
    confirmRef.current();
  }, [disarm]);

  const press = useCallback(() => {
    if (armedRef.current) return confirm();
    setArmedBoth(true);
    disarmTimer.current = setTimeout(disarm, SWELLING_CONFIRM_WINDOW_MS);
  }, [confirm, disarm, setArmedBoth]);

  const holdEnd = useCallback(() => {
    if (holdTimer.current) clearTimeout(holdTimer.current);
    holdTimer.current = null;
  }, []);

  const holdStart = useCallback(() => {
    held.current = false;
    holdEnd();
    holdTimer.current = setTimeout(() => {
      held.current = true;
      confirm();
    }, SWELLING_HOLD_MS);
  }, [confirm, holdEnd]);

  const consumeHold = useCallback(() => {
    const wasHeld = held.current;
    held.current = false;
    return wasHeld;
  }, []);

  useEffect(
    () => () => {
      if (disarmTimer.current) clearTimeout(disarmTimer.current);
      if (holdTimer.current) clearTimeout(holdTimer.current);
    },
    [],
  );

  return { armed, press, holdStart, holdEnd, consumeHold };
}
