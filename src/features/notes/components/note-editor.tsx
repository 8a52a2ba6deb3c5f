import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { NotebookPen, Send } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useNote } from '../api/get-note';
import { noteKeys } from '../api/keys';
import { useSaveNote } from '../api/save-note';
import { useSubmitNote } from '../api/submit-note';
import type { SessionNoteView } from '../../../../shared/notes/responses';
import { sessionNoteUpdateSchema, type SessionNoteUpdate } from '../../../../shared/notes/schemas';
import { placeServerError } from '../lib/server-errors';
import { formatWhen, NoteArea, NoteStatus, NoteText, NoteTrail, soapSections } from './note-parts';

const fields = soapSections.map((s) => s.field);
const valuesOf = (note: SessionNoteView): SessionNoteUpdate => ({ subjective: note.subjective, objective: note.objective, assessment: note.assessment, plan: note.plan });

function NoteForm({ note, runId }: { note: SessionNoteView; runId: string }) {
  const queryClient = useQueryClient();
  const save = useSaveNote(runId);
  const submit = useSubmitNote(runId);
  const { register, handleSubmit, reset, setError, formState } = useForm<SessionNoteUpdate>({ resolver: zodResolver(sessionNoteUpdateSchema), defaultValues: valuesOf(note) });
  const { errors, isDirty } = formState;

  // A saved answer becomes the form's new starting point, so "unsaved changes" means what it says.
  useEffect(() => reset(valuesOf(note)), [note, reset]);

  const failed = (error: unknown) => {
    placeServerError(error, fields, setError);
    // Signed elsewhere while this screen was open: show the locked note instead of a form that cannot save.
    if (error instanceof ApiError && error.status === 409) void queryClient.invalidateQueries({ queryKey: noteKeys.detail(runId) });
  };
  const onSave = handleSubmit((values) => save.mutateAsync(values).catch(failed));
  const onSubmitForSignOff = handleSubmit(async (values) => {
    try {
      if (isDirty) await save.mutateAsync(values);
      await submit.mutateAsync(undefined);
    } catch (error) {
      failed(error);
    }
  });
  const busy = save.isPending || submit.isPending;

  return (
    <form noValidate aria-label="Session note" className="flex flex-col gap-4" onSubmit={onSave}>
      {errors.root?.server ? (
        <Notice kind="error" title="Note not saved">
          {errors.root.server.message}
        </Notice>
      ) : null}
      <div className="grid gap-4 lg:grid-cols-2">
        {soapSections.map((s) => (
          <NoteArea key={s.field} label={`${s.letter} — ${s.title}`} hint={s.hint} rows={10} error={errors[s.field]?.message} {...register(s.field)} />
        ))}
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="secondary" disabled={busy}>
          {save.isPending && !submit.isPending ? 'Saving…' : note.status === 'draft' ? 'Save draft' : 'Save changes'}
        </Button>
        {note.status === 'draft' ? (
          <Button onClick={onSubmitForSignOff} disabled={busy}>
            <Send aria-hidden className="h-4 w-4" /> {submit.isPending ? 'Submitting…' : 'Submit for sign-off'}
          </Button>
        ) : null}
        <p role="status" className="text-sm text-ink-muted">
          {isDirty ? 'Unsaved changes' : `Saved ${formatWhen(note.updatedAt)}`}
        </p>
      </div>
    </form>
  );
}

/**
 * The therapist's SOAP note for a run: drafted by Mendstep from the log, edited and submitted here. Once a
 * supervisor signs it, it is locked and shown as text with the sign-off.
 */
export function NoteEditor({ runId, canEdit }: { runId: string; canEdit: boolean }) {
  const note = useNote(runId);
  return (
    <section aria-labelledby="note-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id="note-heading" className="flex items-center gap-2 text-lg font-semibold">
        <NotebookPen aria-hidden className="h-5 w-5 text-ink-soft" /> Session note (SOAP)
      </h2>
      {note.isPending ? <p className="text-ink-muted">Drafting the note from the run…</p> : null}
      {note.isError ? <p className="text-ember-700">{note.error.message}</p> : null}
      {note.data ? (
        <>
          <NoteStatus note={note.data} />
          <NoteTrail note={note.data} />
          {note.data.locked || !canEdit ? (
            <>
              {note.data.locked ? <p className="text-sm text-ink-muted">This note is locked. Only a supervisor can reopen it, giving a reason.</p> : null}
              <NoteText note={note.data} />
            </>
          ) : (
            <>
              {note.data.status === 'draft' ? (
                <p className="text-sm text-ink-muted">Mendstep drafted this from the run’s log and the latest measurements. Check every line before you submit it.</p>
              ) : null}
              <NoteForm note={note.data} runId={runId} />
            </>
          )}
        </>
      ) : null}
    </section>
  );
}
