import type { InjuryStatus } from '../../../../shared/records/injury';

/** Hierarchical keys: invalidating `lists()` refreshes every list (Today's open injuries among them). */
export const injuryKeys = {
  all: ['injuries'] as const,
  lists: () => [...injuryKeys.all, 'list'] as const,
  list: (filters: { status: InjuryStatus }) => [...injuryKeys.lists(), filters] as const,
  details: () => [...injuryKeys.all, 'detail'] as const,
  detail: (id: string) => [...injuryKeys.details(), id] as const,
};
