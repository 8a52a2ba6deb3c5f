import { resolveRange, reviewRunsQuerySchema } from '../../../shared/review/query';
import { issuesOf } from '../../support/zod-issues';

describe('the review runs query', () => {
  it('fills in the defaults: newest first, page 1 of 25', () => {
    expect(reviewRunsQuerySchema.parse({})).toEqual({ sort: 'createdAt', direction: 'desc', page: 1, pageSize: 25 });
  });

  it('reads page numbers from query text', () => {
    expect(reviewRunsQuerySchema.parse({ page: '3', pageSize: '100' })).toMatchObject({ page: 3, pageSize: 100 });
  });

  it.each([
    [{ pageSize: '0' }, 'pageSize'],
    [{ pageSize: '101' }, 'pageSize'],
    [{ page: '1.5' }, 'page'],
    [{ outcome: 'stop-elevate-refer' }, 'outcome'],
    [{ attention: 'yes' }, 'attention'],
    [{ from: '2026-02-30' }, 'from'],
    [{ to: '12/03/2026' }, 'to'],
    [{ athleteId: '42' }, 'athleteId'],
  ])('refuses %o, naming %s', (query, field) => {
    expect(issuesOf(reviewRunsQuerySchema.safeParse(query)).map((i) => i.path)).toContain(field);
  });

  it('accepts a day or an instant with its offset for either end, and refuses a range that ends before it starts', () => {
    expect(reviewRunsQuerySchema.safeParse({ from: '2026-03-01', to: '2026-03-01T18:00:00+01:00' }).success).toBe(true);
    expect(issuesOf(reviewRunsQuerySchema.safeParse({ from: '2026-03-05', to: '2026-03-01' }))).toEqual([
      { path: 'to', message: 'The end of the range must not be before its start' },
    ]);
  });
});

describe('a date range in the clinic’s zone', () => {
  it('takes whole days in the clinic’s zone, the end day included (London in summer time is UTC+1)', () => {
    const range = resolveRange({ from: '2026-06-01', to: '2026-06-02' }, 'Europe/London');
    expect(range.from!.toISOString()).toBe('2026-05-31T23:00:00.000Z');
    expect(range.to!.toISOString()).toBe('2026-06-02T23:00:00.000Z');
  });

  it('crosses a clock change by the zone’s rules: the last Sunday of March 2026 has 23 hours in London', () => {
    const range = resolveRange({ from: '2026-03-29', to: '2026-03-29' }, 'Europe/London');
    expect(range.to!.getTime() - range.from!.getTime()).toBe(23 * 3_600_000);
  });

  it('keeps instants as given, and leaves open ends open', () => {
    expect(resolveRange({ from: '2026-06-01T08:30:00Z' }, 'Europe/London')).toEqual({ from: new Date('2026-06-01T08:30:00Z'), to: null });
  });
});
