import { useEffect, useState } from 'react';

/** The wall-clock time, refreshed a few times a second: the countdown is derived from it and the deadline. */
export function useNow(intervalMs = 250): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const id = setInterval(() => setNow(Date.now()), intervalMs);
    return () => clearInterval(id);
  }, [intervalMs]);
  return now;
}
