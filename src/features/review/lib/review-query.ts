import { phases } from '../../../../shared/phase';
import { defaultReviewPageSize, reviewOutcomes, reviewSortFields, type ReviewRunsQuery } from '../../../../shared/review/query';

/** The runs list's filters, sort and page (the shared query type): what the address bar keeps so a view can be shared or returned to. */
export type { ReviewRunsQuery };

export type ReviewFilterKey = 'from' | 'to' | 'therapistId' | 'athleteId' | 'phase' | 'outcome' | 'noteSigned' | 'attention';
export const filterKeys: readonly ReviewFilterKey[] = ['from', 'to', 'therapistId', 'athleteId', 'phase', 'outcome', 'noteSigned', 'attention'];

// Newest first: a supervisor's first question is what happened since they last looked.
export const defaultSort: Pick<ReviewRunsQuery, 'sort' | 'direction'> = { sort: 'createdAt', direction: 'desc' };

const isoDate = /^\d{4}-\d{2}-\d{2}$/;
const oneOf = <T extends string>(values: readonly T[], value: string | null): T | undefined =>
  value !== null && (values as readonly string[]).includes(value) ? (value as T) : undefined;
const nonEmpty = (value: string | null) => (value && value.trim() !== '' ? value : undefined);

/** Reads the query from the address; anything unknown or malformed falls back to "no filter" rather than failing. */
export function parseReviewQuery(params: URLSearchParams): ReviewRunsQuery {
  const date = (key: string) => {
    const value = params.get(key);
    return value && isoDate.test(value) ? value : undefined;
  };
  const page = Number(params.get('page'));
  return {
    from: date('from'),
    to: date('to'),
    therapistId: nonEmpty(params.get('therapistId')),
    athleteId: nonEmpty(params.get('athleteId')),
    phase: oneOf(phases, params.get('phase')),
    outcome: oneOf(reviewOutcomes, params.get('outcome')),
    noteSigned: oneOf(['true', 'false'] as const, params.get('noteSigned')),
    // Only 'true' filters; anything else means no attention filter.
    attention: oneOf(['true'] as const, params.get('attention')),
    sort: oneOf(reviewSortFields, params.get('sort')) ?? defaultSort.sort,
    direction: params.get('direction') === 'asc' ? 'asc' : 'desc',
    page: Number.isInteger(page) && page >= 1 ? page : 1,
    pageSize: defaultReviewPageSize,
  };
}

/** The filters alone, in a fixed order: the CSV download and the adherence panel use the same selection. */
export function filterParams(query: Partial<ReviewRunsQuery>): URLSearchParams {
  const out = new URLSearchParams();
  for (const key of filterKeys) {
    const value = query[key];
    if (value) out.set(key, value);
  }
  return out;
}

/** What the API is asked: filters, then sort and page. */
export function reviewRunsSearch(query: ReviewRunsQuery): string {
  const out = filterParams(query);
  out.set('sort', query.sort);
  out.set('direction', query.direction);
  out.set('page', String(query.page));
  out.set('pageSize', String(query.pageSize));
  return out.toString();
}

/** The CSV holds every run matching the filters, in the table's order, without paging. */
export function reviewCsvHref(query: ReviewRunsQuery): string {
  const out = filterParams(query);
  out.set('sort', query.sort);
  out.set('direction', query.direction);
  return `/api/review/runs.csv?${out.toString()}`;
}

/** The address bar's form: defaults are left out so a plain /review stays plain. */
export function toSearchParams(query: ReviewRunsQuery): URLSearchParams {
  const out = filterParams(query);
  if (query.sort !== defaultSort.sort || query.direction !== defaultSort.direction) {
    out.set('sort', query.sort);
    out.set('direction', query.direction);
  }
  if (query.page > 1) out.set('page', String(query.page));
  return out;
}
