import { apiRequest } from '../../../lib/api-client';
import type { SessionNoteView } from '../../../../shared/notes/responses';
import type { SessionNoteUpdate } from '../../../../shared/notes/schemas';
import { notePath, useNoteMutation, type NoteMutationOptions } from './use-note-mutation';

/** 409 once the note is signed: a signed note changes only after a supervisor reopens it. */
export const saveNote = (runId: string, input: SessionNoteUpdate) =>
  apiRequest<{ note: SessionNoteView }>(notePath(runId, '/note'), { method: 'PUT', body: input });

export const useSaveNote = (runId: string, options?: NoteMutationOptions) => useNoteMutation(runId, (input: SessionNoteUpdate) => saveNote(runId, input), options);
