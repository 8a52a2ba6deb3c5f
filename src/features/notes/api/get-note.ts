import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { noteKeys } from './keys';
import type { SessionNoteView } from '../../../../shared/notes/responses';

/** The first read drafts the note from the run's log and measurements, so the therapist starts from text, not a blank page. */
export const getNote = (runId: string) => apiRequest<{ note: SessionNoteView }>(`/api/runs/${encodeURIComponent(runId)}/note`).then((r) => r.note);

export const getNoteQueryOptions = (runId: string) => queryOptions({ queryKey: noteKeys.detail(runId), queryFn: () => getNote(runId) });

export const useNote = (runId: string, enabled = true) => useQuery({ ...getNoteQueryOptions(runId), enabled });
