import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SequenceView } from '../../../../shared/runs/responses';
import { apiRequest } from '../../../lib/api-client';
import { sequenceKeys } from './keys';

/** The clinic's current version of each phase's sequence. */
export const getSequences = () => apiRequest<{ items: SequenceView[] }>('/api/sequences').then((r) => r.items);

export const getSequencesQueryOptions = () => queryOptions({ queryKey: sequenceKeys.current(), queryFn: getSequences });

export const useSequences = () => useQuery(getSequencesQueryOptions());
