import { NotebookPen } from 'lucide-react';
import type { SessionNoteView } from '../../../../shared/notes/responses';
import type { NoteMutationOptions } from '../api/use-note-mutation';
import { NoteStatus, NoteText, NoteTrail } from './note-parts';
import { ReopenForm } from './reopen-form';
import { SignOffForm } from './sign-off-form';

/** The run's note as the supervisor reads it: sign off a submitted note, reopen a signed one. */
export function NoteReviewPanel({ runId, note, canSignOff, onChanged }: { runId: string; note: SessionNoteView | null; canSignOff: boolean } & NoteMutationOptions) {
  return (
    <section aria-labelledby="review-note-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id="review-note-heading" className="flex items-center gap-2 text-lg font-semibold">
        <NotebookPen aria-hidden className="h-5 w-5 text-ink-soft" /> Session note (SOAP)
      </h2>
      {note === null ? (
        <p className="text-ink-muted">The therapist has not opened a note for this run yet.</p>
      ) : (
        <>
          <NoteStatus note={note} />
          <NoteTrail note={note} />
          {note.status === 'draft' ? <p className="text-sm text-ink-muted">Still a draft: it can be signed once the therapist submits it.</p> : null}
          <NoteText note={note} />
          {canSignOff && note.status === 'submitted' ? <SignOffForm runId={runId} onChanged={onChanged} /> : null}
          {canSignOff && note.status === 'signed' ? <ReopenForm runId={runId} onChanged={onChanged} /> : null}
        </>
      )}
    </section>
  );
}
