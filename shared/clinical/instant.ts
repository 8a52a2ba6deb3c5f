/** An instant as the server (Date from the database) or the client (ISO string from JSON) holds it. */
export type Instant = Date | string;

export const msPerMinute = 60_000;
export const msPerHour = 60 * msPerMinute;
export const msPerDay = 24 * msPerHour;

export function toMillis(value: Instant, label = 'date'): number {
  const ms = value instanceof Date ? value.getTime() : Date.parse(value);
  // A silent NaN would grade, phase and schedule as if nothing were wrong; fail loudly instead.
  if (Number.isNaN(ms)) throw new RangeError(`${label} is not a valid date-time: ${String(value)}`);
  return ms;
}

export function hoursBetween(from: Instant, to: Instant): number {
  return (toMillis(to) - toMillis(from)) / msPerHour;
}
