import { DateTime } from 'luxon';
import { coldSchedule, otteApplicationMinutes, type ColdScheduleInput } from '../../../shared/clinical/cold-schedule';

const waking = { start: '07:00', end: '22:00' }; // decisions.md: clinic default waking hours 07:00–22:00

function schedule(input: Partial<ColdScheduleInput> & Pick<ColdScheduleInput, 'start'>) {
  return coldSchedule({ timeZone: 'Europe/Berlin', wakingHours: waking, protocol: 'twenty-each-hour', ...input });
}

const localTimes = (sessions: { startsAt: string }[], zone: string) =>
  sessions.map((s) => DateTime.fromISO(s.startsAt, { zone }).toFormat('HH:mm'));

describe('coldSchedule, 20 minutes of each hour', () => {
  // Common practice: cold 20 minutes out of every hour in the acute phase.
  it('starts at the given time and repeats every 60 minutes for 20 minutes', () => {
    const { sessions } = schedule({ start: '2025-06-12T16:00:00+02:00' });
    expect(localTimes(sessions, 'Europe/Berlin')).toEqual(['16:00', '17:00', '18:00', '19:00', '20:00', '21:00']);
    expect(sessions.every((s) => s.minutes === 20)).toBe(true); // common practice: 20 minutes
    expect(sessions[0].endsAt).toBe('2025-06-12T16:20:00+02:00');
  });

  it('keeps a session that ends exactly at the end of waking hours', () => {
    const { sessions } = schedule({ start: '2025-06-12T21:40:00+02:00' });
    expect(sessions).toEqual([{ startsAt: '2025-06-12T21:40:00+02:00', endsAt: '2025-06-12T22:00:00+02:00', minutes: 20, round: 1 }]);
  });

  it('drops a session that would run past the end of waking hours', () => {
    const { sessions } = schedule({ start: '2025-06-12T20:50:00+02:00' });
    // 20:50–21:10 fits; 21:50–22:10 would overrun the 22:00 end of waking hours (decisions.md default)
    expect(localTimes(sessions, 'Europe/Berlin')).toEqual(['20:50']);
  });

  it('gives no sessions when it starts after waking hours', () => {
    expect(schedule({ start: '2025-06-12T22:30:00+02:00' }).sessions).toEqual([]);
  });

  it('starts at the beginning of waking hours when the start is earlier in the day', () => {
    const { sessions } = schedule({ start: '2025-06-12T05:10:00+02:00' });
    expect(sessions[0].startsAt).toBe('2025-06-12T07:00:00+02:00');
    expect(sessions).toHaveLength(15); // 07:00 … 21:00, one an hour (common practice), within 07:00–22:00 (decisions.md)
  });

  it('places waking hours in local time on the spring clock change in Berlin', () => {
    // Europe/Berlin moved from +01:00 to +02:00 at 01:00 UTC on 30 March 2025 (IANA time zone database)
    const { sessions } = schedule({ start: '2025-03-30T04:00:00Z' });
    expect(sessions[0].startsAt).toBe('2025-03-30T07:00:00+02:00');
    expect(Date.parse(sessions[0].startsAt)).toBe(Date.parse('2025-03-30T05:00:00Z'));
    expect(sessions.at(-1)?.startsAt).toBe('2025-03-30T21:00:00+02:00');
  });

  it('places waking hours in local time on the autumn clock change in Berlin', () => {
    // Europe/Berlin moved from +02:00 to +01:00 at 01:00 UTC on 26 October 2025 (IANA time zone database)
    const { sessions } = schedule({ start: '2025-10-26T05:00:00Z' });
    expect(sessions[0].startsAt).toBe('2025-10-26T07:00:00+01:00');
    expect(sessions).toHaveLength(15);
  });

  it('keeps sessions 60 real minutes apart across a clock change inside waking hours', () => {
    const { sessions } = schedule({ start: '2025-03-30T00:30:00+01:00', wakingHours: { start: '01:00', end: '05:00' } });
    expect(sessions.map((s) => s.startsAt)).toEqual([
      '2025-03-30T01:00:00+01:00',
      '2025-03-30T03:00:00+02:00', // 02:00 local did not exist that night: an hour of real time after 01:00+01:00
      '2025-03-30T04:00:00+02:00',
    ]);
  });

  it('computes "the rest of the day" in the clinic zone, not in UTC', () => {
    // 23:30 UTC on 11 June is 08:30 on 12 June in Tokyo (+09:00, no daylight saving)
    const { sessions } = schedule({ start: '2025-06-11T23:30:00Z', timeZone: 'Asia/Tokyo' });
    expect(sessions[0].startsAt).toBe('2025-06-12T08:30:00+09:00');
    expect(sessions.at(-1)?.startsAt).toBe('2025-06-12T21:30:00+09:00');
  });

  it('refuses an unknown time zone', () => {
    expect(() => schedule({ start: '2025-06-12T10:00:00Z', timeZone: 'Europe/Atlantis' })).toThrow(/Unknown time zone/);
  });
});

describe('coldSchedule, intermittent 10/10/10', () => {
  // Bleakley, McDonough & MacAuley, Br J Sports Med 2006;40:700–705: 10 min ice, 10 min off, 10 min ice, every 2 h.
  it('gives 10 minutes on, 10 off, 10 on, repeated every 2 hours', () => {
    const { sessions, source } = schedule({ start: '2025-06-12T08:00:00+01:00', timeZone: 'Europe/London', protocol: 'intermittent-10-10-10' });
    expect(sessions.slice(0, 4)).toEqual([
      { startsAt: '2025-06-12T08:00:00+01:00', endsAt: '2025-06-12T08:10:00+01:00', minutes: 10, round: 1 },
      { startsAt: '2025-06-12T08:20:00+01:00', endsAt: '2025-06-12T08:30:00+01:00', minutes: 10, round: 1 },
      { startsAt: '2025-06-12T10:00:00+01:00', endsAt: '2025-06-12T10:10:00+01:00', minutes: 10, round: 2 },
      { startsAt: '2025-06-12T10:20:00+01:00', endsAt: '2025-06-12T10:30:00+01:00', minutes: 10, round: 2 },
    ]);
    expect(sessions).toHaveLength(14); // rounds at 08, 10, …, 20 h within 07:00–22:00 (decisions.md)
    expect(source).toContain('Br J Sports Med 2006;40:700–705');
  });

  it('drops a whole round whose second application would run past the end of waking hours', () => {
    const late = schedule({ start: '2025-06-12T21:35:00+02:00', protocol: 'intermittent-10-10-10' });
    expect(late.sessions).toEqual([]); // 21:55–22:05 would overrun 22:00 (decisions.md default)
    const fits = schedule({ start: '2025-06-12T21:30:00+02:00', protocol: 'intermittent-10-10-10' });
    expect(fits.sessions.map((s) => s.endsAt)).toEqual(['2025-06-12T21:40:00+02:00', '2025-06-12T22:00:00+02:00']);
  });
});

describe('cold information beside the schedule', () => {
  it('shows Otte et al. 2002 for a thick fat layer but keeps every session at 20 minutes', () => {
    const result = schedule({ start: '2025-06-12T16:00:00+02:00', skinfoldMm: 35 });
    expect(result.information.otte?.minutes).toBe(60); // Otte et al., Arch Phys Med Rehabil 2002;83:1501–1505: 31–40 mm → 60 min
    expect(Math.max(...result.sessions.map((s) => s.minutes))).toBe(20); // decisions.md: never beyond 20 min continuous
  });

  it('always carries the superficial-nerve caution with its source', () => {
    const [caution] = schedule({ start: '2025-06-12T16:00:00+02:00' }).information.cautions;
    expect(caution.text).toMatch(/fibular head/);
    expect(caution.source).toContain('Clin J Sport Med 1997;7(3):212–216'); // Moeller, Monroe & McKeag 1997
  });

  it('adds a thin-fat-layer caution at 10 mm but not at 11 mm', () => {
    // Otte et al. 2002: skinfold 0–10 mm cooled the muscle 7 °C in 8.0 min
    expect(schedule({ start: '2025-06-12T16:00:00+02:00', skinfoldMm: 10 }).information.cautions).toHaveLength(2);
    expect(schedule({ start: '2025-06-12T16:00:00+02:00', skinfoldMm: 11 }).information.cautions).toHaveLength(1);
  });
});

describe('otteApplicationMinutes', () => {
  // Otte JW, Merrick MA, Ingersoll CD, Cordova ML. Arch Phys Med Rehabil 2002;83:1501–1505:
  // 25 min for ≤ 20 mm, 40 min for 21–30 mm, 60 min for 31–40 mm.
  it.each([
    [5, 25], // Otte et al. 2002: ≤ 20 mm → 25 min
    [20, 25], // Otte et al. 2002: ≤ 20 mm → 25 min
    [20.5, 40], // Otte et al. 2002: 21–30 mm → 40 min; fractional mm into the next band is Mendstep's reading
    [21, 40], // Otte et al. 2002: 21–30 mm → 40 min
    [30, 40], // Otte et al. 2002: 21–30 mm → 40 min
    [31, 60], // Otte et al. 2002: 31–40 mm → 60 min
    [40, 60], // Otte et al. 2002: 31–40 mm → 60 min
  ])('recommends the published time for a %s mm skinfold', (skinfold, minutes) => {
    const result = otteApplicationMinutes(skinfold);
    expect(result.minutes).toBe(minutes);
    expect(result.source).toContain('Arch Phys Med Rehabil 2002;83:1501–1505');
  });

  it('says there is no published figure above 40 mm', () => {
    const result = otteApplicationMinutes(41); // Otte et al. 2002 studied skinfolds up to 40 mm
    expect(result.minutes).toBeNull();
    expect(result.text).toMatch(/no published figure/);
  });

  it('says the figure is information only and not scheduled', () => {
    expect(otteApplicationMinutes(25).text).toMatch(/no more than 20 minutes of continuous cold/); // decisions.md
  });

  it('refuses a skinfold of zero or less', () => {
    expect(() => otteApplicationMinutes(0)).toThrow(RangeError);
  });
});
