import { apiRequest } from '../../../lib/api-client';
import type { SessionNoteView } from '../../../../shared/notes/responses';
import { notePath, useNoteMutation, type NoteMutationOptions } from './use-note-mutation';

export const submitNote = (runId: string) => apiRequest<{ note: SessionNoteView }>(notePath(runId, '/note/submit'), { method: 'POST', body: {} });

export const useSubmitNote = (runId: string, options?: NoteMutationOptions) => useNoteMutation(runId, () => submitNote(runId), options);
