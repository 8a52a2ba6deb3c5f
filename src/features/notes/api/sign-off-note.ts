import { apiRequest } from '../../../lib/api-client';
import type { SessionNoteView } from '../../../../shared/notes/responses';
import type { SignOff } from '../../../../shared/notes/schemas';
import { notePath, useNoteMutation, type NoteMutationOptions } from './use-note-mutation';

/** Supervisors only; signing locks the note. */
export const signOffNote = (runId: string, input: SignOff) =>
  apiRequest<{ note: SessionNoteView }>(notePath(runId, '/sign-off'), { method: 'POST', body: input });

export const useSignOffNote = (runId: string, options?: NoteMutationOptions) => useNoteMutation(runId, (input: SignOff) => signOffNote(runId, input), options);
