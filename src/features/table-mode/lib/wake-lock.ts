import { useEffect, useState } from 'react';

/*
 * Keeps the tablet's screen on while table mode runs: the therapist's hands are on the athlete, not the
 * screen. The Wake Lock API needs a secure context (HTTPS or localhost) and the browser may refuse it (low
 * battery, a policy), so every failure is quiet and only reported through the status.
 */

/** 'off': not asked for, or let go by the browser while the page was hidden. */
export type WakeLockStatus = 'off' | 'held' | 'unavailable' | 'refused';

function wakeLockApi(): WakeLock | null {
  return typeof navigator !== 'undefined' && 'wakeLock' in navigator && navigator.wakeLock ? navigator.wakeLock : null;
}

export function useWakeLock(active: boolean): WakeLockStatus {
  const [status, setStatus] = useState<WakeLockStatus>(() => (wakeLockApi() ? 'off' : 'unavailable'));

  useEffect(() => {
    const api = wakeLockApi();
    if (!api) {
      setStatus('unavailable');
      return;
    }
    if (!active) {
      setStatus('off');
      return;
    }
    let ended = false;
    let sentinel: WakeLockSentinel | null = null;
    let requesting = false;

    const onRelease = () => {
      if (!ended) setStatus('off');
    };

    async function acquire() {
      if (ended || requesting || document.visibilityState !== 'visible') return;
      if (sentinel && !sentinel.released) return;
      requesting = true;
      try {
        const lock = await api!.request('screen');
        if (ended) {
          void lock.release().catch(() => undefined);
          return;
        }
        sentinel = lock;
        lock.addEventListener('release', onRelease);
        setStatus('held');
      } catch {
        if (!ended) setStatus('refused');
      } finally {
        requesting = false;
      }
    }

    // The browser lets the lock go whenever the page is hidden; it must be asked for again on return.
    const onVisibility = () => {
      if (document.visibilityState === 'visible') void acquire();
    };
    document.addEventListener('visibilitychange', onVisibility);
    void acquire();

    return () => {
      ended = true;
      document.removeEventListener('visibilitychange', onVisibility);
      if (sentinel) {
        sentinel.removeEventListener('release', onRelease);
        if (!sentinel.released) void sentinel.release().catch(() => undefined);
      }
    };
  }, [active]);

  return status;
}
