import { forwardRef, useId, type TextareaHTMLAttributes } from 'react';
import { FileClock, FilePen, Lock } from 'lucide-react';
import type { SessionNoteView } from '../../../../shared/notes/responses';
import type { SessionNoteUpdate } from '../../../../shared/notes/schemas';

export const soapSections: { field: keyof SessionNoteUpdate; letter: string; title: string; hint: string }[] = [
  { field: 'subjective', letter: 'S', title: 'Subjective', hint: 'The athlete’s report and pain' },
  { field: 'objective', letter: 'O', title: 'Objective', hint: 'Latest measurements and what was done: steps, times, checks' },
  { field: 'assessment', letter: 'A', title: 'Assessment', hint: 'Phase, severity, risks' },
  { field: 'plan', letter: 'P', title: 'Plan', hint: 'Next steps, home care, the next re-check' },
];

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
export const formatWhen = (iso: string) => when.format(new Date(iso));

const statusLook = {
  draft: { word: 'Draft', Icon: FilePen, className: 'border-ink/25 text-ink-soft' },
  submitted: { word: 'Submitted — waiting for sign-off', Icon: FileClock, className: 'border-phase-proliferative text-ink' },
  signed: { word: 'Signed — locked', Icon: Lock, className: 'border-moss-500 bg-moss-50 text-moss-700' },
};

/** The note's state in a word and an icon. */
export function NoteStatus({ note }: { note: SessionNoteView }) {
  const { word, Icon, className } = statusLook[note.status];
  return (
    <p data-testid="note-status" className={`inline-flex items-center gap-2 self-start rounded-full border-2 px-3 py-1 text-sm font-semibold ${className}`}>
      <Icon aria-hidden className="h-4 w-4" />
      {word}
    </p>
  );
}

/** Who submitted and who signed, in plain words. */
export function NoteTrail({ note }: { note: SessionNoteView }) {
  return (
    <div className="flex flex-col gap-1 text-sm">
      {note.submittedAt ? (
        <p>
          Submitted by {note.submittedByName ?? 'the therapist'} on {formatWhen(note.submittedAt)}
        </p>
      ) : null}
      {note.status === 'signed' && note.signedAt ? (
        <p className="font-semibold" data-testid="note-signed">
          Signed by {note.signedByName ?? 'a supervisor'} on {formatWhen(note.signedAt)}
        </p>
      ) : null}
      {note.status === 'signed' && note.signOffComment ? <p>Comment: “{note.signOffComment}”</p> : null}
    </div>
  );
}

/** S, O, A and P as text, for a note that cannot be edited here. */
export function NoteText({ note }: { note: SessionNoteView }) {
  return (
    <dl className="grid gap-4 lg:grid-cols-2">
      {soapSections.map((s) => (
        <div key={s.field} className="rounded-lg bg-paper p-3">
          <dt className="font-semibold">
            {s.letter} — {s.title}
          </dt>
          <dd className="whitespace-pre-wrap">{note[s.field] || <span className="text-ink-muted">(empty)</span>}</dd>
        </div>
      ))}
    </dl>
  );
}

type AreaProps = TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; hint?: string; error?: string };

/** A labelled text area with its hint and error tied to it, for note writing. */
export const NoteArea = forwardRef<HTMLTextAreaElement, AreaProps>(function NoteArea({ label, hint, error, rows = 4, ...props }, ref) {
  const id = useId();
  const notes = [hint && `${id}-hint`, error && `${id}-error`].filter(Boolean).join(' ');
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      {hint ? <span id={`${id}-hint`} className="text-sm text-ink-muted">{hint}</span> : null}
      <textarea
        ref={ref}
        id={id}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={notes || undefined}
        className={`rounded-lg border bg-paper-raised px-3 py-2 text-base ${error ? 'border-ember-600' : 'border-ink/30'}`}
        {...props}
      />
      {error ? (
        <span id={`${id}-error`} role="alert" className="text-sm font-medium text-ember-700">
          {error}
        </span>
      ) : null}
    </div>
  );
});
