import { athleteCreateSchema, athleteListQuerySchema, athleteUpdateSchema } from '../../../shared/records/athlete';
import { issuesOf } from '../../support/zod-issues';

// All ranges here are validation bounds of ours (the product brief), not clinical figures.
beforeEach(() => {
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(new Date('2025-06-12T12:00:00Z'));
});
afterEach(() => {
  vi.useRealTimers();
});

const valid = { name: 'Rhian Vale', yearOfBirth: 2001, sport: 'Rugby union' };

describe('athleteCreateSchema', () => {
  it('accepts an athlete with optional fields left out or null', () => {
    expect(athleteCreateSchema.safeParse(valid).success).toBe(true);
    expect(athleteCreateSchema.safeParse({ ...valid, position: null, email: null, notes: null }).success).toBe(true);
  });

  it('trims the name and rejects an empty one', () => {
    expect(athleteCreateSchema.parse({ ...valid, name: '  Rhian Vale ' }).name).toBe('Rhian Vale');
    expect(issuesOf(athleteCreateSchema.safeParse({ ...valid, name: '   ' }))).toEqual([
      { path: 'name', message: 'Name must be between 1 and 120 characters' },
    ]);
  });

  it('rejects a name of 121 characters', () => {
    expect(issuesOf(athleteCreateSchema.safeParse({ ...valid, name: 'a'.repeat(121) }))[0].path).toBe('name');
  });

  it('accepts years of birth from 1900 to this year, and rejects 1899 and next year', () => {
    expect(athleteCreateSchema.safeParse({ ...valid, yearOfBirth: 1900 }).success).toBe(true);
    expect(athleteCreateSchema.safeParse({ ...valid, yearOfBirth: 2025 }).success).toBe(true); // system time set to 2025
    expect(issuesOf(athleteCreateSchema.safeParse({ ...valid, yearOfBirth: 1899 }))).toEqual([
      { path: 'yearOfBirth', message: 'Year of birth must be between 1900 and 2025' },
    ]);
    expect(issuesOf(athleteCreateSchema.safeParse({ ...valid, yearOfBirth: 2026 }))).toEqual([
      { path: 'yearOfBirth', message: 'Year of birth must be between 1900 and 2025' },
    ]);
  });

  it('rejects an invalid e-mail address', () => {
    expect(issuesOf(athleteCreateSchema.safeParse({ ...valid, email: 'rhian@' }))).toEqual([
      { path: 'email', message: 'Email must be a valid address, e.g. name@example.org' },
    ]);
  });

  it('rejects notes over 4000 characters', () => {
    expect(issuesOf(athleteCreateSchema.safeParse({ ...valid, notes: 'x'.repeat(4001) }))).toEqual([
      { path: 'notes', message: 'Notes must be at most 4000 characters' },
    ]);
  });

  it('requires a sport', () => {
    expect(issuesOf(athleteCreateSchema.safeParse({ name: 'Rhian Vale', yearOfBirth: 2001 }))[0].path).toBe('sport');
  });
});

describe('athleteUpdateSchema', () => {
  it('accepts a partial update and still checks the ranges', () => {
    expect(athleteUpdateSchema.safeParse({ position: 'Wing' }).success).toBe(true);
    expect(issuesOf(athleteUpdateSchema.safeParse({ yearOfBirth: 1850 }))[0].path).toBe('yearOfBirth');
  });
});

describe('athleteListQuerySchema', () => {
  it('fills in defaults for an empty query string', () => {
    expect(athleteListQuerySchema.parse({})).toEqual({ sort: 'name', direction: 'asc', page: 1, pageSize: 20 });
  });

  it('coerces page numbers from query-string text', () => {
    expect(athleteListQuerySchema.parse({ page: '3', pageSize: '50', sort: 'createdAt', direction: 'desc', q: 'vale' })).toEqual({
      q: 'vale',
      sort: 'createdAt',
      direction: 'desc',
      page: 3,
      pageSize: 50,
    });
  });

  it('rejects page 0, page size 101 and an unknown sort with their paths', () => {
    const issues = issuesOf(athleteListQuerySchema.safeParse({ page: '0', pageSize: '101', sort: 'email' }));
    expect(issues.map((i) => i.path)).toEqual(['sort', 'page', 'pageSize']);
    expect(issues.find((i) => i.path === 'pageSize')?.message).toBe('Page size must be between 1 and 100');
  });

  it('rejects a page number that is not a number', () => {
    expect(issuesOf(athleteListQuerySchema.safeParse({ page: 'two' }))[0].path).toBe('page');
  });
});
