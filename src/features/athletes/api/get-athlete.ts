import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AthleteView, InjuryView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { athleteKeys } from './keys';

/** GET /api/athletes/:id answers with the athlete and their injuries, computed fields included. */
export interface AthleteDetail {
  athlete: AthleteView;
  injuries: InjuryView[];
}

export const getAthlete = (id: string) => apiRequest<AthleteDetail>(`/api/athletes/${encodeURIComponent(id)}`);

// Injuries change from their own page (measurements, overrides); coming back here should show that.
export const getAthleteQueryOptions = (id: string) => queryOptions({ queryKey: athleteKeys.detail(id), queryFn: () => getAthlete(id), staleTime: 0 });

export const useAthlete = (id: string) => useQuery(getAthleteQueryOptions(id));
