import { useEffect, useState } from 'react';

/**
 * The wall-clock time for table mode's countdown and cues. With a deadline it wakes just after each whole
 * second before that deadline, so the numerals turn and the last-five ticks play on the second rather
 * than up to a polling interval late; without one it looks a few times a second.
 */
export function useNow(deadline: number | null = null, idleIntervalMs = 250): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const current = Date.now();
    const left = deadline === null ? null : deadline - current;
    // The deadline itself belongs to the machine's own timer: look just after it has moved the run on, so the
    // step's end is seen once, as the machine's transition, and never also as a crossing of the deadline.
    const untilNextSecond = left === null || left <= 0 ? idleIntervalMs : left <= 1000 ? left + 50 : (left % 1000) + 2;
    const id = setTimeout(() => setNow(Date.now()), Math.max(5, untilNextSecond));
    return () => clearTimeout(id);
  }, [now, deadline, idleIntervalMs]);
  return now;
}
