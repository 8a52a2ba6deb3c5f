import { apiRequest } from '../../../lib/api-client';
import type { SessionNoteView } from '../../../../shared/notes/responses';
import type { Reopen } from '../../../../shared/notes/schemas';
import { notePath, useNoteMutation, type NoteMutationOptions } from './use-note-mutation';

/** Supervisors only; the reason goes into the audit trail beside the reopening. */
export const reopenNote = (runId: string, input: Reopen) =>
  apiRequest<{ note: SessionNoteView }>(notePath(runId, '/note/reopen'), { method: 'POST', body: input });

export const useReopenNote = (runId: string, options?: NoteMutationOptions) => useNoteMutation(runId, (input: Reopen) => reopenNote(runId, input), options);
