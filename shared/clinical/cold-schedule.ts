import { DateTime, IANAZone } from 'luxon';
import type { ColdProtocol, WakingHours } from '../clinic/settings';
import { toMillis, type Instant } from './instant';
import { sources } from './sources';

/** decisions.md: never schedule more than 20 minutes of continuous cold without a supervisor-set override. */
export const maxContinuousColdMinutes = 20;

interface ProtocolPattern {
  /** Minutes from the start of one round to the start of the next. */
  everyMinutes: number;
  /** Cold applications within a round: minutes after the round starts, and their length. */
  applications: readonly { offsetMinutes: number; minutes: number }[];
  source: string;
  description: string;
}

export const coldProtocolPatterns: Record<ColdProtocol, ProtocolPattern> = {
  'twenty-each-hour': {
    everyMinutes: 60,
    applications: [{ offsetMinutes: 0, minutes: 20 }],
    source: sources.commonPractice,
    description: 'Cold for 20 minutes at the start of each hour while awake',
  },
  'intermittent-10-10-10': {
    everyMinutes: 120,
    applications: [
      { offsetMinutes: 0, minutes: 10 },
      { offsetMinutes: 20, minutes: 10 },
    ],
    source: sources.bleakley2006,
    description: 'Cold 10 minutes, off 10 minutes, cold 10 minutes, every 2 hours while awake',
  },
};

export interface ColdSession {
  /** ISO 8601 in the clinic's zone, with its offset, so the local time reads straight off the string. */
  startsAt: string;
  endsAt: string;
  minutes: number;
  /** Which repetition of the protocol this belongs to (1-based); the intermittent protocol has two per round. */
  round: number;
}

export interface InformationLine {
  text: string;
  source: string;
}

export interface OtteRecommendation {
  skinfoldMm: number;
  /** Otte et al.'s recommended application; null above 40 mm, where they published none. */
  minutes: number | null;
  text: string;
  source: string;
}

export interface ColdSchedule {
  protocol: ColdProtocol;
  timeZone: string;
  description: string;
  source: string;
  sessions: ColdSession[];
  /** Shown beside the schedule, never used to lengthen it. */
  information: {
    otte: OtteRecommendation | null;
    cautions: InformationLine[];
  };
}

export interface ColdScheduleInput {
  /** When the first session may begin (usually the end of the run). */
  start: Instant;
  /** The clinic's IANA zone: "the rest of the day" and waking hours are local to it. */
  timeZone: string;
  wakingHours: WakingHours;
  protocol: ColdProtocol;
  skinfoldMm?: number | null;
}

/**
 * The rest of the local day's cold sessions within waking hours. Rounds repeat every 60 (or 120) minutes of
 * elapsed time from `start`, or from the start of waking hours when `start` is earlier; the zone library
 * places waking hours on the right instants on a clock-change day.
 *
 * A round that would run past the end of waking hours is dropped, not clipped: a shortened application is
 * not the protocol the clinic chose, and a few minutes of cold would be noise in the plan. For the
 * intermittent protocol the whole 10/10/10 round goes, since the published protocol is that round.
 */
export function coldSchedule(input: ColdScheduleInput): ColdSchedule {
  if (!IANAZone.isValidZone(input.timeZone)) throw new RangeError(`Unknown time zone: ${input.timeZone}`);
  const pattern = coldProtocolPatterns[input.protocol];
  const start = DateTime.fromMillis(toMillis(input.start, 'start'), { zone: input.timeZone }).startOf('minute');
  const wakeStart = atLocalTime(start, input.wakingHours.start);
  const wakeEnd = atLocalTime(start, input.wakingHours.end);

  const sessions: ColdSession[] = [];
  let roundStart = start.toMillis() < wakeStart.toMillis() ? wakeStart : start;
  for (let round = 1; roundStart.toMillis() < wakeEnd.toMillis(); round += 1) {
    const applications = pattern.applications.map(({ offsetMinutes, minutes }) => {
      const begins = roundStart.plus({ minutes: offsetMinutes });
      return { begins, ends: begins.plus({ minutes }), minutes };
    });
    if (applications.some(({ ends }) => ends.toMillis() > wakeEnd.toMillis())) break;
    for (const { begins, ends, minutes } of applications) {
      sessions.push({ startsAt: isoInZone(begins), endsAt: isoInZone(ends), minutes, round });
    }
    roundStart = roundStart.plus({ minutes: pattern.everyMinutes });
  }

  const skinfold = input.skinfoldMm;
  const hasSkinfold = typeof skinfold === 'number' && Number.isFinite(skinfold) && skinfold > 0;
  return {
    protocol: input.protocol,
    timeZone: input.timeZone,
    description: pattern.description,
    source: pattern.source,
    sessions,
    information: {
      otte: hasSkinfold ? otteApplicationMinutes(skinfold) : null,
      cautions: coldCautions(hasSkinfold ? skinfold : null),
    },
  };
}

/**
 * Otte et al. 2002's recommended crushed-ice application by skinfold: 25 min up to 20 mm, 40 min for
 * 21–30 mm, 60 min for 31–40 mm; nothing published above 40 mm. Bands are read as "up to and including" the
 * upper figure so a fractional skinfold (20.5 mm) falls in the next band. Information only: the schedule
 * itself never exceeds `maxContinuousColdMinutes`.
 */
export function otteApplicationMinutes(skinfoldMm: number): OtteRecommendation {
  if (!Number.isFinite(skinfoldMm) || skinfoldMm <= 0) {
    throw new RangeError(`Skinfold must be a positive number of millimetres, got ${skinfoldMm}`);
  }
  const minutes = skinfoldMm <= 20 ? 25 : skinfoldMm <= 30 ? 40 : skinfoldMm <= 40 ? 60 : null;
  const text =
    minutes === null
      ? `Skinfold ${skinfoldMm} mm: no published figure for fat layers over 40 mm (Otte et al. 2002 studied up to 40 mm).`
      : `Skinfold ${skinfoldMm} mm: Otte et al. 2002 recommend ${minutes} minutes of crushed ice to cool the muscle. ` +
        `Shown for information; Mendstep schedules no more than ${maxContinuousColdMinutes} minutes of continuous cold.`;
  return { skinfoldMm, minutes, text, source: sources.otte2002 };
}

export const superficialNerveCaution: InformationLine = {
  text:
    'Take care where the fat layer is thin or a nerve runs close to the skin (fibular head at the outer knee, ' +
    'medial elbow): common peroneal nerve palsy has followed 20 minutes of icing over the distal hamstring. ' +
    'Check sensation and stop if the area stays numb or tingles.',
  source: `${sources.moeller1997}; see also ${sources.collins1986}`,
};

/** Otte et al.'s thinnest band (0–10 mm) cooled the muscle 7 °C in about 8 minutes: the nerve caution matters most there. */
export const thinFatLayerMm = 10;

function coldCautions(skinfoldMm: number | null): InformationLine[] {
  const cautions: InformationLine[] = [superficialNerveCaution];
  if (skinfoldMm !== null && skinfoldMm <= thinFatLayerMm) {
    cautions.push({
      text: `Thin fat layer (${skinfoldMm} mm): ice cooled the muscle 7 °C in about 8 minutes at skinfolds of 0–10 mm. Check the skin and sensation during each session.`,
      source: sources.otte2002,
    });
  }
  return cautions;
}

function atLocalTime(day: DateTime, hhmm: string): DateTime {
  const match = /^(\d{2}):(\d{2})$/.exec(hhmm);
  if (!match) throw new RangeError(`Waking hours must be HH:mm, got ${hhmm}`);
  return day.set({ hour: Number(match[1]), minute: Number(match[2]), second: 0, millisecond: 0 });
}

function isoInZone(dateTime: DateTime): string {
  const iso = dateTime.toISO({ suppressMilliseconds: true });
  if (iso === null) throw new RangeError('Invalid date-time in cold schedule');
  return iso;
}
