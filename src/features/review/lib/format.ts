const dateTime = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
const dateOnly = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const hourMinute = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' });
const clock = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', second: '2-digit' });

export const formatDateTime = (iso: string) => dateTime.format(new Date(iso));
/** A calendar date from the filters ("2026-12-02") read as that day, whatever the tablet's zone. */
export const formatDay = (day: string) => dateOnly.format(new Date(`${day.slice(0, 10)}T12:00:00`));
/** The calendar day of an instant, on this device's clock. */
export const formatInstantDay = (iso: string) => dateOnly.format(new Date(iso));
export const formatTime = (iso: string) => hourMinute.format(new Date(iso));
export const formatClock = (iso: string) => clock.format(new Date(iso));

/** "6 min", "6 min 30 s", "45 s": how long a step was planned or took. */
export function formatSeconds(seconds: number): string {
  const m = Math.floor(seconds / 60);
  const s = Math.round(seconds % 60);
  if (m === 0) return `${s} s`;
  return s === 0 ? `${m} min` : `${m} min ${s} s`;
}

/** A rate from the API (0–1) as a whole percentage; no runs means no rate, not 0 %. */
export const formatShare = (share: number | null) => (share === null ? '—' : `${Math.round(share * 100)} %`);
