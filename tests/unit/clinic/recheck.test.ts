import { orderForToday, recheckBodySchema, recheckRank, recheckStatus, suggestRecheckAt } from '../../../shared/clinic/recheck';
import { defaultClinicSettings } from '../../../shared/clinic/settings';
import { needsGuardianConsent } from '../../../shared/clinic/guardian-consent';

const intervals = defaultClinicSettings.recheckIntervalHours; // clinic defaults of ours: 24 / 72 / 168 h

describe('next re-check', () => {
  it("suggests the clinic's interval for the phase after the run's end", () => {
    const ended = new Date('2026-11-30T16:40:00Z');
    expect(suggestRecheckAt('acute', ended, intervals).toISOString()).toBe('2026-12-01T16:40:00.000Z');
    expect(suggestRecheckAt('proliferative', ended, intervals).toISOString()).toBe('2026-12-03T16:40:00.000Z');
    expect(suggestRecheckAt('remodelling', ended, { ...intervals, remodelling: 96 }).toISOString()).toBe('2026-12-04T16:40:00.000Z');
  });

  it("calls a re-check due when it falls later on the clinic's today, overdue once it has passed", () => {
    // 12:00 UTC on 1 Dec is 23:00 in Sydney: a re-check at 12:30 UTC is already the 2nd there.
    const now = new Date('2026-12-01T12:00:00Z');
    expect(recheckStatus('2026-12-01T11:59:00Z', now, 'Australia/Sydney')).toBe('overdue');
    expect(recheckStatus('2026-12-01T12:50:00Z', now, 'Australia/Sydney')).toBe('due');
    expect(recheckStatus('2026-12-01T13:30:00Z', now, 'Australia/Sydney')).toBe('later');
    expect(recheckStatus('2026-12-01T13:30:00Z', now, 'Europe/London')).toBe('due');
    expect(recheckStatus(null, now, 'Europe/London')).toBe('none');
    expect([recheckRank('overdue'), recheckRank('due'), recheckRank('later')]).toEqual([0, 1, 2]);
  });

  it('accepts a future time or null, and refuses the past and a time more than a year away', () => {
    expect(recheckBodySchema.safeParse({ nextRecheckAt: new Date(Date.now() + 3_600_000).toISOString() }).success).toBe(true);
    expect(recheckBodySchema.safeParse({ nextRecheckAt: null }).success).toBe(true);
    expect(recheckBodySchema.safeParse({ nextRecheckAt: new Date(Date.now() - 86_400_000).toISOString() }).error?.issues[0].message).toBe('Next re-check must be in the future');
    expect(recheckBodySchema.safeParse({ nextRecheckAt: new Date(Date.now() + 400 * 86_400_000).toISOString() }).success).toBe(false);
    expect(recheckBodySchema.safeParse({ nextRecheckAt: '2027-01-01 10:00' }).success).toBe(false);
  });
});

describe('guardian consent by year of birth', () => {
  it("counts an athlete who reaches 17 or 18 this year (in the clinic's zone) as possibly under 18, and one who reaches 19 as not", () => {
    const now = new Date('2026-06-01T12:00:00Z');
    expect(needsGuardianConsent(2009, now, 'Europe/London')).toBe(true);
    // Turns 18 in 2026 but may not have had the birthday yet: the safe side is to ask for a guardian.
    expect(needsGuardianConsent(2008, now, 'Europe/London')).toBe(true);
    expect(needsGuardianConsent(2007, now, 'Europe/London')).toBe(false);
  });

  it("reads the year in the clinic's zone: on New Year's morning in Sydney it is already next year", () => {
    const now = new Date('2026-12-31T14:00:00Z'); // 01:00 on 1 Jan 2027 in Sydney
    expect(needsGuardianConsent(2008, now, 'Australia/Sydney')).toBe(false);
    expect(needsGuardianConsent(2008, now, 'Europe/London')).toBe(true);
  });
});

describe("Today's order", () => {
  it('puts overdue re-checks first, then those due today, each soonest first, and keeps the rest in their order', () => {
    const list = [
      { id: 'newest, none', recheckStatus: 'none' as const, nextRecheckAt: null },
      { id: 'due 15:00', recheckStatus: 'due' as const, nextRecheckAt: '2026-12-01T15:00:00Z' },
      { id: 'later', recheckStatus: 'later' as const, nextRecheckAt: '2026-12-04T09:00:00Z' },
      { id: 'overdue since 09:00', recheckStatus: 'overdue' as const, nextRecheckAt: '2026-12-01T09:00:00Z' },
      { id: 'due 13:00', recheckStatus: 'due' as const, nextRecheckAt: '2026-12-01T13:00:00Z' },
      { id: 'overdue since yesterday', recheckStatus: 'overdue' as const, nextRecheckAt: '2026-11-30T09:00:00Z' },
      { id: 'oldest, none', recheckStatus: 'none' as const, nextRecheckAt: null },
    ];
    expect(orderForToday(list).map((i) => i.id)).toEqual([
      'overdue since yesterday',
      'overdue since 09:00',
      'due 13:00',
      'due 15:00',
      'newest, none',
      'later',
      'oldest, none',
    ]);
  });
});
