import type { Phase } from '../phase';
import { toMillis, type Instant } from './instant';

/**
 * How long a measurement stays current before Today asks for a new one. Clinic defaults of ours (no
 * published interval): daily while acute, when swelling can change within hours; every three days in the
 * proliferative phase; weekly while remodelling.
 */
export const remeasureAfterHours: Record<Phase, number> = { acute: 24, proliferative: 72, remodelling: 168 };

export function isRemeasureDue(phase: Phase, lastMeasuredAt: Instant | null, now: Instant): boolean {
  if (lastMeasuredAt === null) return true;
  return toMillis(now, 'now') - toMillis(lastMeasuredAt, 'lastMeasuredAt') >= remeasureAfterHours[phase] * 3_600_000;
}
