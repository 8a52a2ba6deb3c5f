import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { LockOpen } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useReopenNote } from '../api/reopen-note';
import { reopenSchema, type Reopen } from '../../../../shared/notes/schemas';
import type { NoteMutationOptions } from '../api/use-note-mutation';
import { placeServerError } from '../lib/server-errors';
import { NoteArea } from './note-parts';

/** Reopening a signed note undoes a sign-off, so it asks first and needs a reason for the audit trail. */
export function ReopenForm({ runId, onChanged }: { runId: string } & NoteMutationOptions) {
  const [open, setOpen] = useState(false);
  const reopen = useReopenNote(runId, { onChanged });
  const { register, handleSubmit, setError, formState } = useForm<Reopen>({ resolver: zodResolver(reopenSchema), defaultValues: { reason: '' } });
  const { errors } = formState;
  if (!open) {
    return (
      <Button variant="secondary" className="self-start" onClick={() => setOpen(true)}>
        <LockOpen aria-hidden className="h-4 w-4" /> Reopen the note…
      </Button>
    );
  }
  const onSubmit = handleSubmit((values) => reopen.mutateAsync(values).then(() => setOpen(false), (error) => placeServerError(error, ['reason'], setError)));
  return (
    <form noValidate aria-label="Reopen the note" className="flex flex-col gap-3 border-t border-ink/10 pt-3" onSubmit={onSubmit}>
      {errors.root?.server ? (
        <Notice kind="error" title="Not reopened">
          {errors.root.server.message}
        </Notice>
      ) : null}
      <NoteArea label="Why reopen it?" hint="At least 5 characters; kept in the audit trail" rows={2} error={errors.reason?.message} {...register('reason')} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant="danger" disabled={reopen.isPending}>
          {reopen.isPending ? 'Reopening…' : 'Reopen the note'}
        </Button>
        <Button variant="ghost" onClick={() => setOpen(false)}>
          Keep it signed
        </Button>
      </div>
    </form>
  );
}
