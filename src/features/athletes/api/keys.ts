import type { AthleteListQuery } from '../../../../shared/records/athlete';

export const athleteKeys = {
  all: ['athletes'] as const,
  lists: () => [...athleteKeys.all, 'list'] as const,
  list: (query: AthleteListQuery) => [...athleteKeys.lists(), query] as const,
  details: () => [...athleteKeys.all, 'detail'] as const,
  detail: (id: string) => [...athleteKeys.details(), id] as const,
};
