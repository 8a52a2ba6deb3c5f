import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noteKeys } from './keys';
import type { SessionNoteView } from '../../../../shared/notes/responses';

/*
 * Every change to a note has one shape: send, put the answer in the cache, then let the screen refresh
 * whatever else shows the note (the review desk's run and table) through `onChanged`.
 */
export type NoteMutationOptions = { onChanged?: (note: SessionNoteView) => unknown };

export const notePath = (runId: string, tail: string) => `/api/runs/${encodeURIComponent(runId)}${tail}`;

export function useNoteMutation<I>(runId: string, send: (input: I) => Promise<{ note: SessionNoteView }>, options: NoteMutationOptions = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: I) => send(input).then((r) => r.note),
    onSuccess: async (note) => {
      queryClient.setQueryData(noteKeys.detail(runId), note);
      await options.onChanged?.(note);
    },
  });
}
