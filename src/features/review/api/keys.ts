import type { ReviewRunsQuery } from '../lib/review-query';

/** Hierarchical keys: a sign-off invalidates `all` so the table's note column and the run's page both refresh. */
export const reviewKeys = {
  all: ['review'] as const,
  runLists: () => [...reviewKeys.all, 'runs'] as const,
  runList: (query: ReviewRunsQuery) => [...reviewKeys.runLists(), query] as const,
  run: (id: string) => [...reviewKeys.all, 'run', id] as const,
  filters: () => [...reviewKeys.all, 'filters'] as const,
  adherence: (range: { from?: string; to?: string }) => [...reviewKeys.all, 'adherence', range] as const,
};
