/** The step's remaining time as large numerals inside a ring that empties as the step runs. */
export function formatClock(ms: number): string {
  const total = Math.ceil(ms / 1000);
  const m = Math.floor(total / 60);
  const s = total % 60;
  return `${m}:${String(s).padStart(2, '0')}`;
}

export function CountdownRing({ remainingMs, totalMs, paused }: { remainingMs: number | null; totalMs: number; paused: boolean }) {
  const fraction = remainingMs === null || totalMs <= 0 ? 1 : Math.min(1, Math.max(0, remainingMs / totalMs));
  const radius = 47;
  const circumference = 2 * Math.PI * radius;
  return (
    // Wide enough that "20:00" at a fifth of the screen's height sits inside the ring.
    <div className="relative flex shrink-0 items-center justify-center" style={{ height: '58vh', width: '58vh' }}>
      <svg viewBox="0 0 100 100" className="absolute inset-0 h-full w-full -rotate-90" aria-hidden>
        <circle cx="50" cy="50" r={radius} fill="none" stroke="#27393f" strokeWidth="3" />
        <circle
          cx="50"
          cy="50"
          r={radius}
          fill="none"
          stroke={paused ? '#8fa3a8' : '#7fd1b9'}
          strokeWidth="3"
          strokeLinecap="round"
          strokeDasharray={circumference}
          strokeDashoffset={circumference * (1 - fraction)}
        />
      </svg>
      <p
        className="font-semibold tabular-nums leading-none tracking-tight text-paper"
        style={{ fontSize: '20vh' }}
        data-testid="countdown"
        aria-live="off"
      >
        {remainingMs === null ? '—' : formatClock(remainingMs)}
      </p>
    </div>
  );
}
